import { describe, expect, it } from "vitest";
import { polygonArea, polygonCentroid } from "#core/analysis/geometry/polygon-area";
import type { PolygonFixture } from "#core/contracts/fixtures";
import * as act from "./actions";
import { applyAction, applyActions } from "./actions";
import { planPoint } from "../../../lib/plan-view/coordinates";
import { createScene, fixturesInBox, hitTest, sceneErrors, sceneFixtures, type Scene } from "./scene";
import { closeTo, idSource, openCase, rect, room, uuid, valve } from "./test-builders";

const plan = { width: 40, height: 20 };
const poly = (s: Scene, id: string) => (s.fixtures[id] as PolygonFixture).polygon;

function store(): Scene {
  return createScene(plan, [
    openCase(1, rect(2, 2, 3.75, 1.1), "Dairy 1"),
    room(2, rect(30, 2, 6, 4), { edge: 2, offset: 2, width: 1.2 }),
    valve(3, 5, 5),
  ]);
}

describe("scene", () => {
  it("hit-tests the topmost fixture, with a tolerance for points", () => {
    const s = store();
    expect(hitTest(s, planPoint(3, 2.5), 0.1)).toBe(uuid(1));
    expect(hitTest(s, planPoint(5.05, 5), 0.1)).toBe(uuid(3));
    expect(hitTest(s, planPoint(20, 10), 0.1)).toBeNull();
    expect(fixturesInBox(s, { minX: 0, minY: 0, maxX: 10, maxY: 10 })).toEqual([uuid(1), uuid(3)]);
  });
  it("reports the same errors as the server's validation", () => {
    const s = createScene(plan, [openCase(1, rect(38, 2, 3, 1))]);
    expect(sceneErrors(s).map((e) => e.path)).toEqual(["fixtures.0.polygon.1", "fixtures.0.polygon.2"]);
  });
});

describe("actions", () => {
  it("moves a selection, clamped to the plan", () => {
    const s = applyAction(store(), act.move([uuid(1), uuid(3)], 1, 0.5));
    expect(poly(s, uuid(1))[0]).toEqual([3, 2.5]);
    expect(s.fixtures[uuid(3)]).toMatchObject({ point: { x: 6, y: 5.5 } });
    const far = applyAction(store(), act.move([uuid(1)], -10, 0));
    expect(poly(far, uuid(1))[0]).toEqual([0, 2]); // stopped at the plan's left edge
  });

  it("rotates 90° about the centroid, baking the turn into the vertices", () => {
    // A 4 m × 2 m case centred on (6, 5): a quarter turn makes it 2 m × 4 m about the same centre.
    const s0 = createScene(plan, [openCase(1, rect(4, 4, 4, 2))]);
    const s = applyAction(s0, act.rotate([uuid(1)], Math.PI / 2));
    expect(
      closeTo(poly(s, uuid(1)), [
        [7, 3],
        [7, 7],
        [5, 7],
        [5, 3],
      ]),
    ).toBe(true);
    expect(polygonCentroid(poly(s, uuid(1)))[0]).toBeCloseTo(6, 12);
    expect(polygonArea(poly(s, uuid(1)))).toBeCloseTo(8, 12);
  });

  it("rotates a group about a shared pivot", () => {
    const s = applyAction(store(), act.rotate([uuid(3)], Math.PI, [4, 4]));
    const p = (s.fixtures[uuid(3)] as { point: { x: number; y: number } }).point;
    expect(p.x).toBeCloseTo(3, 12);
    expect(p.y).toBeCloseTo(3, 12);
  });

  it("makes an array of 5 cases at 2.4 m with new ids and counted labels", () => {
    // A row of five 2.4 m cases (a common 8 ft module: 2.44 m, common practice, no published source).
    const s0 = createScene(plan, [openCase(1, rect(2, 2, 2.4, 1.1), "Dairy 1")]);
    const s = applyAction(s0, act.array([uuid(1)], 5, 2.4, [1, 0], idSource()));
    const all = sceneFixtures(s) as PolygonFixture[];
    expect(all).toHaveLength(5);
    expect(new Set(all.map((f) => f.id)).size).toBe(5);
    expect(all.map((f) => f.label)).toEqual(["Dairy 1", "Dairy 2", "Dairy 3", "Dairy 4", "Dairy 5"]);
    all.forEach((f, k) => expect(f.polygon[0][0]).toBeCloseTo(2 + 2.4 * k, 12));
    expect(all[4].polygon[1][0]).toBeCloseTo(2 + 2.4 * 5, 12);
    expect(s.selection).toEqual(all.slice(1).map((f) => f.id));
  });

  it("duplicates with an offset and selects the copies", () => {
    const s = applyAction(store(), act.duplicate([uuid(1), uuid(3)], 0, 2, idSource()));
    expect(s.order).toHaveLength(5);
    expect(s.selection).toEqual([uuid(1000), uuid(1001)]);
    expect(poly(s, uuid(1000))[0]).toEqual([2, 4]);
    expect(s.fixtures[uuid(1000)].label).toBe("Dairy 2");
  });

  it("numbers the copies of an unnumbered label without repeating a label already on the plan", () => {
    const s0 = createScene(plan, [
      openCase(1, rect(2, 2, 2.4, 1.1), "Freezer"),
      openCase(2, rect(2, 6, 2.4, 1.1), "Freezer 3"),
    ]);
    const s1 = applyAction(s0, act.array([uuid(1)], 4, 2.4, [1, 0], idSource()));
    expect(s1.selection.map((id) => s1.fixtures[id].label)).toEqual(["Freezer 2", "Freezer 4", "Freezer 5"]);
    const s2 = applyAction(s1, act.duplicate([uuid(1)], 0, 2, idSource(2000)));
    expect(s2.fixtures[uuid(2000)].label).toBe("Freezer 6");
  });

  it("resizes to a new box and keeps a room's door on its edge", () => {
    const s = applyAction(store(), act.resize(uuid(2), { minX: 30, minY: 2, maxX: 33, maxY: 6 }));
    expect(poly(s, uuid(2))).toEqual(rect(30, 2, 3, 4));
    // The door's centre was 2.6 m along the 6 m edge (43%); on the 3 m edge it is at 1.3 m.
    const door = (s.fixtures[uuid(2)] as { door: { offset: number; width: number } }).door;
    expect(door.width).toBe(1.2);
    expect(door.offset + door.width / 2).toBeCloseTo(1.3, 12);
  });

  it("sets vertices, properties and labels only where they apply", () => {
    let s = applyAction(
      store(),
      act.setVertices(uuid(1), [
        [2, 2],
        [6, 2],
        [4, 4],
      ]),
    );
    expect(poly(s, uuid(1))).toHaveLength(3);
    s = applyAction(
      s,
      act.setProperties([uuid(1), uuid(2)], { systemId: uuid(50), door: { edge: 0, offset: 5.5, width: 1 } }),
    );
    expect(s.fixtures[uuid(1)].systemId).toBe(uuid(50));
    expect("door" in s.fixtures[uuid(1)]).toBe(false);
    expect(s.fixtures[uuid(2)]).toMatchObject({ systemId: uuid(50), door: { edge: 0, offset: 5, width: 1 } });
    s = applyAction(s, act.label(uuid(3), "Suction valve"));
    expect(s.fixtures[uuid(3)].label).toBe("Suction valve");
    expect(() => act.label(uuid(3), "x".repeat(81))).toThrow("label must be at most 80 characters");
  });

  it("deletes and multi-selects", () => {
    let s = applyActions(store(), [
      act.select([uuid(1)]),
      act.select([uuid(3)], "add"),
      act.select([uuid(1)], "toggle"),
    ]);
    expect(s.selection).toEqual([uuid(3)]);
    s = applyActions(s, [act.select([uuid(1), uuid(2)], "add"), act.remove([uuid(2), uuid(3)])]);
    expect(s.order).toEqual([uuid(1)]);
    expect(s.selection).toEqual([uuid(1)]);
  });

  it("returns the same scene for no-ops and ignores unknown ids", () => {
    const s = store();
    expect(applyAction(s, act.move(["nope"], 1, 1))).toBe(s);
    expect(applyAction(s, act.rotate([uuid(1)], 0))).toBe(s);
    expect(applyAction(s, act.select([]))).toBe(s);
    expect(applyAction(s, act.setProperties([uuid(1)], { hasFans: true, doorCount: 3 }))).toBe(s); // already has fans; no door count
    expect(applyAction(s, act.label(uuid(1), "Dairy 1"))).toBe(s);
  });

  it("refuses bad arguments with a named reason", () => {
    expect(() => act.move([uuid(1)], Number.NaN, 0)).toThrow("move dx, dy must be finite numbers");
    expect(() => act.array([uuid(1)], 1, 2.4, [1, 0], idSource())).toThrow(/array count/);
    expect(() => act.array([uuid(1)], 3, 2.4, [0, 0], idSource())).toThrow(/zero vector/);
    expect(() => act.resize(uuid(1), { minX: 1, minY: 1, maxX: 1, maxY: 2 })).toThrow(/width and height above 0/);
  });
});
