/**
 * The shared fixture schema (zod 4): the one definition the server validates saves with and
 * the layout editor checks drafts with, so both give the same field errors.
 *
 * Geometry is in plan metres: origin at the plan's top-left corner, x right, y down. Polygons
 * carry any rotation baked into their vertices; points are {x, y}.
 */
import { z } from "zod";
import { text } from "./text";
import { bounded, PLAN_COORD_MAX_M, PPM_PHYSICAL_MAX } from "./quantities";
import { polygonArea } from "../analysis/geometry/polygon-area";
import { isSelfIntersecting } from "../analysis/geometry/segments";
import { FIXTURE_KINDS, POINT_KINDS, ROOM_KINDS, SOLID_BODY_KINDS } from "./fixture-kinds";

export const LABEL_MAX = 80;
export const NOTE_MAX = 500;
/** Bounds the O(n²) crossing test and the payload; real outlines have tens of vertices. */
export const POLYGON_MAX_VERTICES = 200;
export const FIXTURES_MAX = 5000;
/** Rounding after rotations may leave a vertex a hair outside; a micrometre is no error. */
export const BOUNDS_TOLERANCE_M = 1e-6;

const metres = bounded("metres", -PLAN_COORD_MAX_M, PLAN_COORD_MAX_M);

export const PlanPointSchema = z.object({ x: metres, y: metres }, { error: "must be an {x, y} position in metres" });
export const VertexSchema = z.tuple([metres, metres], { error: "must be an [x, y] pair of metres" });
export const PolygonSchema = z
  .array(VertexSchema, { error: "must be a list of [x, y] vertices" })
  .min(3, { error: "needs at least 3 vertices" })
  .max(POLYGON_MAX_VERTICES, { error: `has more than ${POLYGON_MAX_VERTICES} vertices` });

/** A room's door: a gap in one edge (from vertex `edge` to the next), `offset` m from its start. */
export const RoomDoorSchema = z.object(
  {
    edge: z.number().int({ error: "must be a whole edge index" }).min(0, { error: "must be 0 or more" }),
    offset: metres.min(0, { error: "must be 0 m or more along the edge" }),
    width: metres.gt(0, { error: "must be more than 0 m" }),
  },
  { error: "must be {edge, offset, width} or null" },
);

const base = {
  id: z.uuid({ error: "must be a UUID" }),
  label: text({ error: "must be text" }).max(LABEL_MAX, { error: `must be at most ${LABEL_MAX} characters` }),
  systemId: z.uuid({ error: "must be a system's UUID or null" }).nullable(),
  hasFans: z.boolean({ error: "must be true or false" }),
};

const PLAIN_POLYGON_KINDS = ["open-case", "island-case", ...SOLID_BODY_KINDS] as const;

export const PlainFixtureSchema = z.object({
  ...base,
  kind: z.enum(PLAIN_POLYGON_KINDS),
  polygon: PolygonSchema,
});
export const DoorCaseFixtureSchema = z.object({
  ...base,
  kind: z.literal("door-case"),
  polygon: PolygonSchema,
  doorCount: z
    .number()
    .int({ error: "must be a whole number of doors" })
    .min(1, { error: "must be at least 1" })
    .max(100, { error: "must be at most 100" }),
});
export const RoomFixtureSchema = z.object({
  ...base,
  kind: z.enum(ROOM_KINDS),
  polygon: PolygonSchema,
  /** null until the lead tech marks the door; the locator then treats the room as sealed. */
  door: RoomDoorSchema.nullable(),
});
export const BenignZoneFixtureSchema = z.object({
  ...base,
  kind: z.literal("benign-zone"),
  polygon: PolygonSchema,
  note: text({ error: "must be text" }).max(NOTE_MAX, { error: `must be at most ${NOTE_MAX} characters` }),
  typicalPpm: bounded("ppm", 0, PPM_PHYSICAL_MAX).nullable(),
});
export const PointFixtureSchema = z.object({
  ...base,
  kind: z.enum(POINT_KINDS),
  point: PlanPointSchema,
});

export const FixtureSchema = z.discriminatedUnion(
  "kind",
  [PlainFixtureSchema, DoorCaseFixtureSchema, RoomFixtureSchema, BenignZoneFixtureSchema, PointFixtureSchema],
  {
    error: (issue) =>
      typeof issue.input === "object" && issue.input !== null && !Array.isArray(issue.input)
        ? `must be one of: ${FIXTURE_KINDS.join(", ")}`
        : "must be a fixture object",
  },
);

export type Vertex = z.infer<typeof VertexSchema>;
export type RoomDoor = z.infer<typeof RoomDoorSchema>;
export type PlainFixture = z.infer<typeof PlainFixtureSchema>;
export type DoorCaseFixture = z.infer<typeof DoorCaseFixtureSchema>;
export type RoomFixture = z.infer<typeof RoomFixtureSchema>;
export type BenignZoneFixture = z.infer<typeof BenignZoneFixtureSchema>;
export type PointFixture = z.infer<typeof PointFixtureSchema>;
export type Fixture = z.infer<typeof FixtureSchema>;
export type PolygonFixture = Exclude<Fixture, PointFixture>;

export const PlanBoundsSchema = z.object({
  width: metres.gt(0, { error: "must be more than 0 m" }),
  height: metres.gt(0, { error: "must be more than 0 m" }),
});
export type PlanBounds = z.infer<typeof PlanBoundsSchema>;

export function isPointFixture(f: Fixture): f is PointFixture {
  return "point" in f;
}

/**
 * The checks that need the plan's size or look across fields: edges that cross, zero area,
 * vertices and points outside the plan, a door that does not fit its edge, repeated ids.
 * Issue paths are relative to the fixture list (e.g. [3, "polygon", 2]).
 */
function addListIssues(fixtures: readonly Fixture[], bounds: PlanBounds, ctx: z.RefinementCtx): void {
  const malformed = new Set(ctx.issues.map((issue) => issue.path?.[0]));
  const seen = new Map<string, number>();
  const where = `the plan (0–${bounds.width} m × 0–${bounds.height} m)`;
  const inside = (x: number, y: number) =>
    x >= -BOUNDS_TOLERANCE_M &&
    y >= -BOUNDS_TOLERANCE_M &&
    x <= bounds.width + BOUNDS_TOLERANCE_M &&
    y <= bounds.height + BOUNDS_TOLERANCE_M;
  fixtures.forEach((f, i) => {
    if (malformed.has(i)) return;
    const first = seen.get(f.id);
    if (first !== undefined)
      ctx.addIssue({ code: "custom", path: [i, "id"], message: `repeats the id of fixtures.${first}` });
    else seen.set(f.id, i);
    if (isPointFixture(f)) {
      if (!inside(f.point.x, f.point.y))
        ctx.addIssue({ code: "custom", path: [i, "point"], message: `lies outside ${where}` });
      return;
    }
    const poly = f.polygon;
    poly.forEach(([x, y], v) => {
      if (!inside(x, y))
        ctx.addIssue({ code: "custom", path: [i, "polygon", v], message: `vertex (${x}, ${y}) lies outside ${where}` });
    });
    const repeated = poly.findIndex((p, v) => {
      const q = poly[(v + 1) % poly.length];
      return p[0] === q[0] && p[1] === q[1];
    });
    if (repeated >= 0)
      ctx.addIssue({
        code: "custom",
        path: [i, "polygon", (repeated + 1) % poly.length],
        message: "repeats the vertex before it",
      });
    else if (isSelfIntersecting(poly))
      ctx.addIssue({ code: "custom", path: [i, "polygon"], message: "has edges that cross each other" });
    else if (polygonArea(poly) < 1e-9)
      ctx.addIssue({ code: "custom", path: [i, "polygon"], message: "has no area (all vertices on one line)" });
    if ("door" in f && f.door) addDoorIssues(f.door, poly, i, ctx);
  });
}

function addDoorIssues(door: RoomDoor, poly: readonly Vertex[], i: number, ctx: z.RefinementCtx): void {
  if (door.edge >= poly.length) {
    ctx.addIssue({
      code: "custom",
      path: [i, "door", "edge"],
      message: `must name one of the outline's ${poly.length} edges (0–${poly.length - 1})`,
    });
    return;
  }
  const [ax, ay] = poly[door.edge];
  const [bx, by] = poly[(door.edge + 1) % poly.length];
  const length = Math.hypot(bx - ax, by - ay);
  if (door.offset + door.width > length + BOUNDS_TOLERANCE_M) {
    ctx.addIssue({
      code: "custom",
      path: [i, "door", "width"],
      message: `runs past the end of its ${length.toFixed(2)} m edge (offset + width = ${(door.offset + door.width).toFixed(2)} m)`,
    });
  }
}

/** A zod schema of a whole fixture list on a plan of the given size (for validate middleware). */
export function fixtureListSchema(bounds: PlanBounds) {
  return (
    z
      .array(FixtureSchema, { error: "must be a list of fixtures" })
      .max(FIXTURES_MAX, { error: `must hold at most ${FIXTURES_MAX} fixtures` })
      // Geometry is judged for every fixture whose shape parsed, so one typo does not hide the
      // other errors, while a NaN vertex is not also reported as "outside".
      .superRefine((fixtures, ctx) => addListIssues(fixtures, bounds, ctx), {
        when: (payload) => Array.isArray(payload.value),
      })
  );
}

export interface FieldError {
  /** Dotted path from the list's name, e.g. "fixtures.3.polygon". */
  path: string;
  message: string;
}

export type FixtureListResult = { ok: true; fixtures: Fixture[] } | { ok: false; errors: FieldError[] };

/**
 * Validates a whole fixture list against the plan's bounds. The server and the editor both call
 * this, so a lead tech sees in the editor exactly the errors a save would return.
 */
export function validateFixtureList(input: unknown, bounds: PlanBounds, root = "fixtures"): FixtureListResult {
  const b = PlanBoundsSchema.safeParse(bounds);
  if (!b.success) return { ok: false, errors: toFieldErrors(b.error, "plan") };
  const r = fixtureListSchema(b.data).safeParse(input);
  if (r.success) return { ok: true, fixtures: r.data };
  // Geometry issues are added after the shape issues; list them fixture by fixture instead.
  const byFixture = [...r.error.issues].sort((a, b) => Number(a.path[0] ?? -1) - Number(b.path[0] ?? -1));
  return { ok: false, errors: byFixture.map((issue) => toFieldError(issue, root)) };
}

export function toFieldErrors(error: z.ZodError, root: string): FieldError[] {
  return error.issues.map((issue) => toFieldError(issue, root));
}

function toFieldError(issue: z.core.$ZodIssue, root: string): FieldError {
  return { path: [root, ...issue.path.map(String)].join("."), message: issue.message };
}
