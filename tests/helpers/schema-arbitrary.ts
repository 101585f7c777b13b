import fc from "fast-check";
import { z } from "zod";

// Request bodies for the fuzz test, made from the contracts themselves: zod 4's JSON Schema of a
// contract (its input side) turned into fast-check arbitraries, plus hostile edits of those values.

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };
type Schema = {
  type?: string | string[];
  properties?: Record<string, Schema>;
  required?: string[];
  items?: Schema;
  prefixItems?: Schema[];
  anyOf?: Schema[];
  oneOf?: Schema[];
  allOf?: Schema[];
  enum?: Json[];
  const?: Json;
  format?: string;
  pattern?: string;
  minLength?: number;
  maxLength?: number;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minItems?: number;
  maxItems?: number;
  additionalProperties?: Schema | boolean;
  $ref?: string;
  $defs?: Record<string, Schema>;
  default?: Json;
};

const anyJson: fc.Arbitrary<Json> = fc.jsonValue({ maxDepth: 2 }) as fc.Arbitrary<Json>;

function fromJsonSchema(s: Schema, defs: Record<string, Schema>, depth: number): fc.Arbitrary<Json> {
  if (depth > 8) return fc.constant(null);
  const next = (x: Schema) => fromJsonSchema(x, defs, depth + 1);
  if (s.$ref) return next(defs[s.$ref.split("/").pop()!] ?? {});
  if (s.const !== undefined) return fc.constant(s.const);
  if (s.enum) return fc.constantFrom(...s.enum);
  const options = s.anyOf ?? s.oneOf;
  if (options) return fc.oneof(...options.map(next));
  if (s.allOf?.length) return next(s.allOf[0]);
  if (Array.isArray(s.type)) return fc.oneof(...s.type.map((type) => next({ ...s, type })));
  switch (s.type) {
    case "null":
      return fc.constant(null);
    case "boolean":
      return fc.boolean();
    case "integer":
    case "number": {
      const min = s.minimum ?? (s.exclusiveMinimum !== undefined ? s.exclusiveMinimum + 1e-6 : -1e6);
      const max = s.maximum ?? (s.exclusiveMaximum !== undefined ? s.exclusiveMaximum - 1e-6 : 1e6);
      const lo = Math.max(min, -1e9);
      const hi = Math.min(max, 1e9);
      if (s.type === "integer") return fc.integer({ min: Math.ceil(lo), max: Math.max(Math.ceil(lo), Math.floor(hi)) });
      return fc.double({ min: lo, max: Math.max(lo, hi), noNaN: true, noDefaultInfinity: true });
    }
    case "string":
      return stringArbitrary(s);
    case "array": {
      if (s.prefixItems) return fc.tuple(...s.prefixItems.map(next));
      const minLength = s.minItems ?? 0;
      return fc.array(next(s.items ?? {}), { minLength, maxLength: Math.max(minLength, Math.min(s.maxItems ?? 4, 4)) });
    }
    case "object": {
      const props = s.properties ?? {};
      const record = Object.fromEntries(Object.entries(props).map(([k, v]) => [k, next(v)]));
      return fc.record(record, { requiredKeys: (s.required ?? []).filter((k) => k in props) }) as fc.Arbitrary<Json>;
    }
    default:
      return anyJson;
  }
}

function stringArbitrary(s: Schema): fc.Arbitrary<string> {
  switch (s.format) {
    case "uuid":
      return fc.uuid();
    case "email":
      return fc.emailAddress();
    case "date-time":
      return fc
        .integer({ min: Date.UTC(2020, 0, 1), max: Date.UTC(2030, 0, 1) })
        .map((ms) => new Date(ms).toISOString());
    case "date":
      return fc
        .integer({ min: Date.UTC(2020, 0, 1), max: Date.UTC(2030, 0, 1) })
        .map((ms) => new Date(ms).toISOString().slice(0, 10));
  }
  if (s.pattern) return fc.stringMatching(new RegExp(s.pattern)).filter((x) => x.length <= (s.maxLength ?? 200));
  const minLength = s.minLength ?? 0;
  return fc.string({ minLength, maxLength: Math.max(minLength, Math.min(s.maxLength ?? 30, 30)), unit: "grapheme" });
}

/** Values shaped like the contract's input (mostly valid, sometimes not: JSON Schema cannot say everything zod checks). */
export function contractArbitrary(schema: z.ZodType): fc.Arbitrary<Json> {
  const json = z.toJSONSchema(schema, {
    io: "input",
    unrepresentable: "any",
    reused: "inline",
    cycles: "ref",
  }) as Schema;
  return fromJsonSchema(json, json.$defs ?? {}, 0);
}

/** What an attacker or a broken client puts in a field. */
export const hostileValue: fc.Arbitrary<Json> = fc.oneof(
  fc.constantFrom<Json>(
    "\u0000",
    "note\u0000end",
    "a\uD800b",
    "\uDC00",
    "",
    "   ",
    "x".repeat(100_000),
    '=HYPERLINK("http://example.invalid")',
    "../../etc/passwd",
    "%00",
    "<script>alert(1)</script>",
    "1e308",
    "NaN",
    1e308,
    -1e308,
    5e-324,
    -0,
    2 ** 53 + 1,
    -1,
    0,
    null,
    true,
    [],
    {},
    [null],
    { "": null },
    { __proto__: { polluted: true } } as unknown as Json,
    JSON.parse('{"__proto__":{"polluted":true}}'),
    JSON.parse('{"constructor":{"prototype":{"polluted":true}}}'),
  ),
  fc.string({ unit: "binary", maxLength: 20 }),
  fc.double(),
  anyJson,
);

/** Every place in a JSON value, as a path of keys and indexes (the root is []). */
function places(v: Json, path: Array<string | number> = [], out: Array<Array<string | number>> = []) {
  out.push(path);
  if (Array.isArray(v)) v.forEach((x, i) => places(x, [...path, i], out));
  else if (v && typeof v === "object") for (const [k, x] of Object.entries(v)) places(x, [...path, k], out);
  return out;
}

function replaceAt(v: Json, path: Array<string | number>, value: Json): Json {
  if (path.length === 0) return value;
  const [head, ...rest] = path;
  if (Array.isArray(v)) return v.map((x, i) => (i === head ? replaceAt(x, rest, value) : x));
  const o = v as Record<string, Json>;
  return { ...o, [head]: replaceAt(o[head], rest, value) };
}

/** A contract-shaped value with one place (a field, an item, or the whole) swapped for a hostile one. */
export function mutatedArbitrary(schema: z.ZodType): fc.Arbitrary<Json> {
  return fc.tuple(contractArbitrary(schema), fc.nat(), hostileValue).map(([v, n, bad]) => {
    const all = places(v);
    return replaceAt(v, all[n % all.length], bad);
  });
}

/** A mix for one route: contract-shaped, contract-shaped with one hostile field, and arbitrary JSON. */
export function bodyArbitrary(schema: z.ZodType | undefined): fc.Arbitrary<Json> {
  if (!schema) return fc.oneof(anyJson, hostileValue);
  return fc.oneof(
    { weight: 3, arbitrary: contractArbitrary(schema) },
    { weight: 4, arbitrary: mutatedArbitrary(schema) },
    { weight: 1, arbitrary: anyJson },
  );
}
