import { describe, expect, it } from "vitest";
import { FIXTURE_FAMILY, FIXTURE_KIND_NAMES, FIXTURE_KINDS } from "./fixture-kinds";
import { validateFixtureList, type Fixture } from "./fixtures";

const plan = { width: 20, height: 10 };
const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, "0")}`;
const rect = (x: number, y: number, w: number, h: number): [number, number][] => [
  [x, y],
  [x + w, y],
  [x + w, y + h],
  [x, y + h],
];

function valid(): Fixture[] {
  return [
    {
      id: id(1),
      kind: "open-case",
      label: "Dairy 1",
      systemId: id(100),
      hasFans: true,
      polygon: rect(1, 1, 3.75, 1.1),
    },
    {
      id: id(2),
      kind: "door-case",
      label: "Frozen 1",
      systemId: null,
      hasFans: true,
      polygon: rect(1, 4, 3.75, 1),
      doorCount: 5,
    },
    {
      id: id(3),
      kind: "walk-in-cooler",
      label: "Dairy cooler",
      systemId: null,
      hasFans: true,
      polygon: rect(12, 1, 4, 3),
      door: { edge: 2, offset: 1, width: 1.2 },
    },
    {
      id: id(4),
      kind: "benign-zone",
      label: "Aerosols",
      systemId: null,
      hasFans: false,
      polygon: rect(8, 7, 2, 1),
      note: "aerosol storage",
      typicalPpm: 3,
    },
    { id: id(5), kind: "valve", label: "Ball valve", systemId: null, hasFans: false, point: { x: 2, y: 3 } },
    { id: id(6), kind: "column", label: "", systemId: null, hasFans: false, polygon: rect(10, 5, 0.4, 0.4) },
  ];
}

function errorsOf(input: unknown) {
  const r = validateFixtureList(input, plan);
  if (r.ok) throw new Error("expected errors");
  return r.errors;
}

describe("fixture kinds", () => {
  it("gives every kind a family and a plain English name", () => {
    expect(FIXTURE_KINDS).toHaveLength(14);
    for (const k of FIXTURE_KINDS) {
      expect(FIXTURE_FAMILY[k]).toMatch(/^(air-volume|solid-body|zone|point)$/);
      expect(FIXTURE_KIND_NAMES[k]).toMatch(/^[A-Z][a-z -]+$/);
    }
    expect(FIXTURE_FAMILY["walk-in-freezer"]).toBe("air-volume");
    expect(FIXTURE_FAMILY.gondola).toBe("solid-body");
    expect(FIXTURE_KIND_NAMES["door-case"]).toBe("Glass-door case");
  });
});

describe("validateFixtureList", () => {
  it("accepts a valid list and returns it parsed", () => {
    const r = validateFixtureList(valid(), plan);
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.fixtures).toEqual(valid());
  });

  it("names the field of a polygon with too few vertices", () => {
    const list = valid();
    (list[3] as { polygon: unknown }).polygon = [
      [0, 0],
      [1, 1],
    ];
    expect(errorsOf(list)).toEqual([{ path: "fixtures.3.polygon", message: "needs at least 3 vertices" }]);
  });

  it("refuses a self-intersecting (bow-tie) polygon", () => {
    const list = valid();
    (list[0] as { polygon: unknown }).polygon = [
      [1, 1],
      [3, 1],
      [1, 3],
      [3, 3],
    ];
    expect(errorsOf(list)).toEqual([{ path: "fixtures.0.polygon", message: "has edges that cross each other" }]);
  });

  it("refuses vertices and points outside the plan, naming the vertex", () => {
    const list = valid();
    (list[5] as { polygon: unknown }).polygon = rect(19.8, 5, 0.4, 0.4);
    (list[4] as { point: unknown }).point = { x: 2, y: 10.5 };
    const errors = errorsOf(list);
    expect(errors.map((e) => e.path)).toEqual(["fixtures.4.point", "fixtures.5.polygon.1", "fixtures.5.polygon.2"]);
    expect(errors[1].message).toBe("vertex (20.2, 5) lies outside the plan (0–20 m × 0–10 m)");
  });

  it("refuses non-finite numbers, unknown kinds, long labels and bad ids with their paths", () => {
    const list: unknown[] = valid();
    (list[0] as { polygon: unknown }).polygon = [
      [1, 1],
      [Number.NaN, 1],
      [2, 2],
    ];
    list[1] = { ...(list[1] as object), kind: "freezer-case" };
    (list[2] as { label: string }).label = "x".repeat(81);
    (list[5] as { id: string }).id = "c1";
    const errors = errorsOf(list);
    expect(errors).toContainEqual({ path: "fixtures.0.polygon.1.0", message: "must be a finite number of metres" });
    expect(errors.find((e) => e.path === "fixtures.1.kind")?.message).toMatch(/must be one of: open-case/);
    expect(errors).toContainEqual({ path: "fixtures.2.label", message: "must be at most 80 characters" });
    expect(errors).toContainEqual({ path: "fixtures.5.id", message: "must be a UUID" });
  });

  it("explains missing and wrong-shaped fields, fixture by fixture", () => {
    const list: unknown[] = valid();
    (list[0] as { polygon: unknown }).polygon = rect(1, 1, 30, 1); // geometry error on fixture 0
    delete (list[4] as { point?: unknown }).point;
    delete (list[2] as { door?: unknown }).door;
    list[5] = "column";
    expect(errorsOf(list)).toEqual([
      { path: "fixtures.0.polygon.1", message: "vertex (31, 1) lies outside the plan (0–20 m × 0–10 m)" },
      { path: "fixtures.0.polygon.2", message: "vertex (31, 2) lies outside the plan (0–20 m × 0–10 m)" },
      { path: "fixtures.2.door", message: "must be {edge, offset, width} or null" },
      { path: "fixtures.4.point", message: "must be an {x, y} position in metres" },
      { path: "fixtures.5", message: "must be a fixture object" },
    ]);
  });

  it("refuses infinity (JSON cannot carry it, but a client object can)", () => {
    const list = valid();
    (list[4] as { point: unknown }).point = { x: Infinity, y: 1 };
    expect(errorsOf(list)).toEqual([{ path: "fixtures.4.point.x", message: "must be a finite number of metres" }]);
  });

  it("checks kind-specific props: door count and a room's door on its edge", () => {
    const list = valid();
    (list[1] as { doorCount: number }).doorCount = 0;
    (list[2] as { door: unknown }).door = { edge: 1, offset: 2.5, width: 1 }; // edge 1 is 3 m long
    expect(errorsOf(list)).toEqual([
      { path: "fixtures.1.doorCount", message: "must be at least 1" },
      { path: "fixtures.2.door.width", message: "runs past the end of its 3.00 m edge (offset + width = 3.50 m)" },
    ]);
    (list[1] as { doorCount: number }).doorCount = 2;
    (list[2] as { door: unknown }).door = { edge: 4, offset: 0, width: 1 };
    expect(errorsOf(list)).toEqual([
      { path: "fixtures.2.door.edge", message: "must name one of the outline's 4 edges (0–3)" },
    ]);
  });

  it("refuses repeated ids, repeated vertices and flat polygons", () => {
    const list = valid();
    list[5].id = id(1);
    (list[0] as { polygon: unknown }).polygon = [
      [1, 1],
      [2, 1],
      [2, 1],
      [2, 2],
    ];
    (list[3] as { polygon: unknown }).polygon = [
      [1, 1],
      [2, 1],
      [3, 1],
    ];
    expect(errorsOf(list)).toEqual([
      { path: "fixtures.0.polygon.2", message: "repeats the vertex before it" },
      { path: "fixtures.3.polygon", message: "has no area (all vertices on one line)" },
      { path: "fixtures.5.id", message: "repeats the id of fixtures.0" },
    ]);
  });

  it("refuses a plan of no size under the plan path", () => {
    expect(validateFixtureList([], { width: 0, height: 10 })).toEqual({
      ok: false,
      errors: [{ path: "plan.width", message: "must be more than 0 m" }],
    });
  });
});
