import { z } from "zod";
import { text } from "./text";
import { signedArea } from "../analysis/geometry/polygon-area";
import { isSelfIntersecting } from "../analysis/geometry/segments";

// The locator's command-line interchange format (docs/locator/command-line.md). Its short names are fixed by the contract
// because other tools read and write it; inside the product the words of docs/product.md are used.
// Units: metres and seconds, plan origin top-left, x right, y down.

/** Cells the analysis may allocate; about 80 bytes of working arrays per cell keeps this near 120 MB. */
export const MAX_GRID_CELLS = 1_500_000;
export const DEFAULT_CELL_SIZE_M = 0.25;

export function gridCellCount(width: number, height: number, cellSize: number): number {
  return Math.ceil(width / cellSize) * Math.ceil(height / cellSize);
}

const finite = (what: string) =>
  z
    .number({ error: `${what} must be a number` })
    .refine(Number.isFinite, { message: `${what} must be a finite number` });

const vertex = z.tuple([finite("a vertex coordinate"), finite("a vertex coordinate")], {
  error: "each vertex must be an [x, y] pair of numbers in metres",
});

/** Drops an explicit closing vertex equal to the first, so both spellings of a closed outline are accepted. */
function openRing(points: readonly (readonly [number, number])[]): [number, number][] {
  const ring = points.map((p) => [p[0], p[1]] as [number, number]);
  if (ring.length > 1) {
    const a = ring[0];
    const b = ring[ring.length - 1];
    if (a[0] === b[0] && a[1] === b[1]) ring.pop();
  }
  return ring;
}

const polygon = z.array(vertex, { error: "polygon must be an array of [x, y] vertices" }).transform((points, ctx) => {
  const ring = openRing(points);
  if (ring.length < 3) {
    ctx.addIssue({ code: "custom", message: `polygon needs at least 3 distinct vertices, got ${ring.length}` });
    return z.NEVER;
  }
  if (Math.abs(signedArea(ring)) < 1e-9) {
    ctx.addIssue({ code: "custom", message: "polygon does not close around any area (its vertices are collinear)" });
    return z.NEVER;
  }
  if (isSelfIntersecting(ring)) {
    ctx.addIssue({ code: "custom", message: "polygon does not close into a simple outline (its edges cross)" });
    return z.NEVER;
  }
  return ring;
});

const id = text({ error: "id must be a string" }).min(1, "id must not be empty");

export const locatorFixtureKinds = ["open-case", "island-case", "door-case", "walk-in", "machine-room"] as const;
export const locatorRiskPointKinds = ["line-set", "valve", "coil"] as const;
export const locatorReadingPoints = ["grille", "supply", "return", "floor", "high", "ambient"] as const;

const obstacle = z.object({ id, polygon });
const fixture = z.object({
  id,
  kind: z.enum(locatorFixtureKinds, { error: `kind must be one of ${locatorFixtureKinds.join(", ")}` }),
  polygon,
  fans: z.boolean({ error: "fans must be true or false" }).optional().default(false),
});
const riskPoint = z.object({
  id,
  kind: z.enum(locatorRiskPointKinds, { error: `kind must be one of ${locatorRiskPointKinds.join(", ")}` }),
  x: finite("x"),
  y: finite("y"),
});
const backgroundZone = z.object({
  id,
  polygon,
  ppm: finite("ppm")
    .refine((v) => v >= 0, "ppm must not be negative")
    .optional(),
  note: text().optional(),
});

const plan = z.object({
  width: finite("width").refine((v) => v > 0, "width must be positive"),
  height: finite("height").refine((v) => v > 0, "height must be positive"),
  obstacles: z.array(obstacle).optional().default([]),
  fixtures: z.array(fixture).optional().default([]),
  riskPoints: z.array(riskPoint).optional().default([]),
  backgroundZones: z.array(backgroundZone).optional().default([]),
});

const instrument = z.object({
  transportDelayS: finite("transportDelayS").refine((v) => v >= 0, "transportDelayS must not be negative"),
  timeConstantS: finite("timeConstantS").refine((v) => v >= 0, "timeConstantS must not be negative"),
  alarmPpm: finite("alarmPpm").refine((v) => v > 0, "alarmPpm must be positive"),
});

const reading = z.object({
  x: finite("x"),
  y: finite("y"),
  t: finite("t").refine((v) => v >= 0, "t must not be negative (seconds from the sweep's start)"),
  ppm: z
    .number({
      error: (issue) => (Number.isNaN(issue.input) ? "ppm must be a number, not NaN" : "ppm must be a number"),
    })
    .refine((v) => Number.isFinite(v), "ppm must be finite")
    .refine((v) => v >= 0, "ppm must not be negative"),
  atLeast: z.boolean({ error: "atLeast must be true or false" }).optional(),
  point: z.enum(locatorReadingPoints, { error: `point must be one of ${locatorReadingPoints.join(", ")}` }).optional(),
  note: text().optional(),
  /** The id of the pass the reading was taken in (`passes`); without it, the plan's conditions as given. */
  pass: id.optional(),
});

/**
 * A later pass over part of the store under other air conditions (fans stopped, a defrost), so its
 * readings are fitted with their own air model while the sources stay shared with the first pass.
 */
const pass = z.object({
  id,
  fans: z.enum(["running", "stopped"], { error: "fans must be running or stopped" }),
  defrost: z.boolean({ error: "defrost must be true or false" }).optional().default(false),
  /** The fixture whose fans were stopped or which was in defrost; without it, every fixture. */
  fixture: id.optional(),
});

export const locatorInputSchema = z
  .object({
    plan,
    instrument,
    readings: z.array(reading, { error: "readings must be an array" }).min(1, "readings must not be empty"),
    passes: z
      .array(pass, { error: "passes must be an array" })
      .max(100, "passes must hold at most 100 passes")
      .optional()
      .default([]),
  })
  .superRefine((input, ctx) => {
    const { width, height } = input.plan;
    const cells = gridCellCount(width, height, DEFAULT_CELL_SIZE_M);
    if (cells > MAX_GRID_CELLS) {
      ctx.addIssue({
        code: "custom",
        path: ["plan", "width"],
        message: `a ${width} m x ${height} m plan needs ${cells} cells at ${DEFAULT_CELL_SIZE_M} m, over the memory budget of ${MAX_GRID_CELLS}`,
      });
    }
    const passIds = new Set<string>();
    const fixtureIds = new Set(input.plan.fixtures.map((f) => f.id));
    input.passes.forEach((p, i) => {
      if (passIds.has(p.id))
        ctx.addIssue({ code: "custom", path: ["passes", i, "id"], message: `pass id "${p.id}" is used twice` });
      passIds.add(p.id);
      if (p.fixture !== undefined && !fixtureIds.has(p.fixture))
        ctx.addIssue({
          code: "custom",
          path: ["passes", i, "fixture"],
          message: `fixture "${p.fixture}" is not a fixture of the plan`,
        });
    });
    input.readings.forEach((r, i) => {
      if (r.pass !== undefined && !passIds.has(r.pass))
        ctx.addIssue({ code: "custom", path: ["readings", i, "pass"], message: `pass "${r.pass}" is not in passes` });
      if (r.x < 0 || r.x > width || r.y < 0 || r.y > height) {
        ctx.addIssue({
          code: "custom",
          path: ["readings", i],
          message: `reading at (${r.x}, ${r.y}) lies outside the ${width} m x ${height} m plan`,
        });
      }
      if (i > 0 && r.t < input.readings[i - 1].t) {
        ctx.addIssue({
          code: "custom",
          path: ["readings", i, "t"],
          message: `time goes backwards: ${r.t} s after ${input.readings[i - 1].t} s (readings must be in time order)`,
        });
      }
    });
  });

/** The parsed input; `passes` may be left out by callers that build an input in code (it is then none). */
export type LocatorInput = Omit<z.output<typeof locatorInputSchema>, "passes"> & {
  passes?: z.output<typeof locatorInputSchema>["passes"];
};
export type LocatorInputRaw = z.input<typeof locatorInputSchema>;
// Named apart from the product's Fixture and Reading (core/contracts/fixtures.ts, sweeps.ts): these are the
// command-line format's records; the JSON field names stay those of docs/locator/command-line.md.
export type LocatorReading = LocatorInput["readings"][number];
export type LocatorFixture = LocatorInput["plan"]["fixtures"][number];
export type LocatorRiskPoint = LocatorInput["plan"]["riskPoints"][number];
export type LocatorBackgroundZone = LocatorInput["plan"]["backgroundZones"][number];
export type LocatorInstrument = LocatorInput["instrument"];
export type LocatorPass = z.output<typeof locatorInputSchema>["passes"][number];
export type LocatorFixtureKind = (typeof locatorFixtureKinds)[number];
export type LocatorRiskPointKind = (typeof locatorRiskPointKinds)[number];

/** "readings[3].ppm: ppm must not be negative" — one line per problem, naming the field. */
export function formatIssues(error: z.ZodError): string[] {
  return error.issues.map((issue) => {
    const path = issue.path
      .map((p, i) => (typeof p === "number" ? `[${p}]` : `${i === 0 ? "" : "."}${String(p)}`))
      .join("");
    return `${path || "input"}: ${issue.message}`;
  });
}

export class LocatorInputError extends Error {
  constructor(readonly problems: string[]) {
    super(`invalid locator input:\n  ${problems.join("\n  ")}`);
    this.name = "LocatorInputError";
  }
}

/** Parses and checks the contract input; throws LocatorInputError listing every problem. */
export function parseLocatorInput(value: unknown): LocatorInput {
  const parsed = locatorInputSchema.safeParse(value);
  if (!parsed.success) throw new LocatorInputError(formatIssues(parsed.error));
  return parsed.data;
}
