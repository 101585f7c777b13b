import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { z } from "zod";
import { createTestApp, signIn, type Agent, type TestApp } from "../helpers/test-app";
import { seedCompany } from "../helpers/fixtures";
import { routeTable } from "../../server/lib/route-table";
import { readingInput } from "#core/contracts/sweeps";
import { FixtureSchema } from "#core/contracts/fixtures";
import { analysisQuery } from "#core/contracts/analysis";
import { detectorInput } from "#core/contracts/detectors";

// Every number a route reads has a plausible range stated in its contract (core/contracts/quantities.ts):
// a hostile 1e308 or -1e308 is refused at the field, never stored.

let t: TestApp;
let owner: Agent;
let co: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Kestrel Foods");
  owner = await signIn(t.app, co.people.owner);
});
afterAll(() => t.close());

type Def = { type: string; [k: string]: unknown };
const defOf = (s: z.ZodType) => (s as unknown as { _zod: { def: Def } })._zod.def;

/** The type a pipe first reads (pipes nest: number → transform → bounded number). */
function firstInput(schema: z.ZodType): string {
  const def = defOf(schema);
  return def.type === "pipe" ? firstInput(def.in as z.ZodType) : def.type;
}

function numberNodes(
  schema: z.ZodType,
  path: string,
  out: Array<[string, z.ZodType]>,
  seen = new Set<z.ZodType>(),
): void {
  if (seen.has(schema)) return;
  seen.add(schema);
  const def = defOf(schema);
  const walk = (s: unknown, p: string): void => numberNodes(s as z.ZodType, p, out, seen);
  switch (def.type) {
    case "number":
    case "int":
      out.push([path, schema]);
      return;
    case "pipe":
      if (["number", "int"].includes(firstInput(schema))) out.push([path, schema]);
      else {
        walk(def.in, path);
        walk(def.out, path);
      }
      return;
    case "object":
      for (const [k, v] of Object.entries(def.shape as Record<string, z.ZodType>)) walk(v, `${path}.${k}`);
      return;
    case "array":
      return walk(def.element, `${path}[]`);
    case "record":
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

describe("numbers in the contracts", () => {
  it("every number a route reads refuses ±1e308", () => {
    const nodes: Array<[string, z.ZodType]> = [];
    for (const r of routeTable(t.app))
      for (const part of ["body", "query", "params"] as const) {
        const s = r[part];
        if (s) numberNodes(s, `${r.method.toUpperCase()} ${r.path} ${part}`, nodes);
      }
    // Read item by item in their services (so one bad item is reported alone).
    numberNodes(readingInput, "reading", nodes);
    numberNodes(FixtureSchema, "fixture", nodes);
    expect(nodes.length).toBeGreaterThan(30);
    const unbounded = nodes
      .filter(([, s]) => s.safeParse(1e308).success || s.safeParse(-1e308).success)
      .map(([p]) => p);
    expect(unbounded).toEqual([]);
  });

  it("keeps analysis and detector delays to tenths of a second", () => {
    expect(analysisQuery.parse({ transportDelayS: "5.04", timeConstantS: "1e-300" })).toEqual({
      transportDelayS: 5,
      timeConstantS: 0,
    });
    const d = detectorInput.parse({
      name: "Diode",
      principle: "heated-diode",
      transportDelayS: 7.36,
      timeConstantS: 1e-49,
    });
    expect([d.transportDelayS, d.timeConstantS]).toEqual([7.4, 0]);
  });
});

describe("plans", () => {
  it("refuses a 1e308 m calibration or blank plan at the field", async () => {
    const blank = await owner.post(`/api/stores/${co.store.id}/plans/blank`, { width: 1e308, depth: 30, unit: "m" });
    expect(blank.status).toBe(400);
    expect(blank.body.error.fields.width).toMatch(/at most/);
    const feet = await owner.post(`/api/stores/${co.store.id}/plans/blank`, { width: 100, depth: 7000, unit: "ft" });
    expect(feet.body.error.fields.depth).toMatch(/at most 2000 m/);
    const ok = await owner.post(`/api/stores/${co.store.id}/plans/blank`, { width: 6000, depth: 300, unit: "ft" });
    expect(ok.status).toBe(201);
  });
});
