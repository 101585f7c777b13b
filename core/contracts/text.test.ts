import { describe, expect, it } from "vitest";
import { z } from "zod";
import { NUL_REASON, SURROGATE_REASON, text } from "./text";

// Every module of core/contracts, so a new contract is covered without anyone listing it.
const modules = import.meta.glob<Record<string, unknown>>(["./*.ts", "!./*.test.ts"], { eager: true });

type Def = { type: string; [k: string]: unknown };
const defOf = (s: z.ZodType) => (s as unknown as { _zod: { def: Def } })._zod.def;

/** Every place a contract reads a string, with its path: leaves, pipes that start from a string, record keys. */
function stringNodes(
  schema: z.ZodType,
  path: string,
  out: Array<[string, z.ZodType]>,
  seen = new Set<z.ZodType>(),
): void {
  if (seen.has(schema)) return;
  seen.add(schema);
  const def = defOf(schema);
  const walk = (s: unknown, p: string): void => stringNodes(s as z.ZodType, p, out, seen);
  switch (def.type) {
    case "string":
      out.push([path, schema]);
      return;
    case "pipe":
      if (defOf(def.in as z.ZodType).type === "string") out.push([path, schema]);
      else walk(def.in, path);
      return;
    case "object":
      for (const [k, v] of Object.entries(def.shape as Record<string, z.ZodType>)) walk(v, `${path}.${k}`);
      if (def.catchall) walk(def.catchall, `${path}.*`);
      return;
    case "array":
      return walk(def.element, `${path}[]`);
    case "record":
      walk(def.keyType, `${path}{key}`);
      return walk(def.valueType, `${path}{}`);
    case "union":
      return (def.options as z.ZodType[]).forEach((o, i) => walk(o, `${path}|${i}`));
    case "intersection":
      walk(def.left, path);
      return walk(def.right, path);
    case "tuple":
      return (def.items as z.ZodType[]).forEach((o, i) => walk(o, `${path}[${i}]`));
    case "lazy":
      return walk((def.getter as () => z.ZodType)(), path);
    default:
      for (const key of ["innerType", "schema"]) if (def[key]) walk(def[key], path);
  }
}

describe("text()", () => {
  it("refuses NUL and lone surrogates with a reason, and keeps real characters", () => {
    const s = text().trim().max(20, "too long");
    expect(s.safeParse("a\u0000b").error?.issues[0].message).toBe(NUL_REASON);
    for (const bad of ["\uD83D", "x\uDC00y", "\uDC00\uD83D", "ok\uD83D"])
      expect(s.safeParse(bad).error?.issues[0].message).toBe(SURROGATE_REASON);
    for (const good of ["Dairy case 3", "🧊 ice", "Kühlregal", "冷蔵ケース", "\uD83D\uDE00"])
      expect(s.safeParse(good).success).toBe(true);
  });
});

describe("every contract", () => {
  const nodes: Array<[string, z.ZodType]> = [];
  for (const [file, mod] of Object.entries(modules))
    for (const [name, value] of Object.entries(mod))
      if (value instanceof z.ZodType) stringNodes(value, `${file.slice(2)}:${name}`, nodes);

  it("has string fields to check (the walker found them)", () => {
    expect(nodes.length).toBeGreaterThan(150);
  });

  it("refuses a NUL and a lone surrogate in every text field", () => {
    const letThrough = nodes
      .filter(([, s]) => s.safeParse("Dairy\u0000case").success || s.safeParse("Dairy\uD83Dcase").success)
      .map(([p]) => p);
    expect(letThrough).toEqual([]);
  });
});
