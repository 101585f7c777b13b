import { describe, expect, it } from "vitest";
import { pointInPolygon } from "../../analysis/geometry/point-in-polygon";
import { polygonArea } from "../../analysis/geometry/polygon-area";
import type { Fixture } from "../../contracts/fixtures";
import { roomWalls } from "./room-walls";
import { toLocatorPlan } from "./to-locator-input";

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, "0")}`;
const rect = (x: number, y: number, w: number, h: number): [number, number][] => [
  [x, y],
  [x + w, y],
  [x + w, y + h],
  [x, y + h],
];
const blocked = (walls: [number, number][][], p: [number, number]) => walls.some((w) => pointInPolygon(p, w));

// An invented store: a 4 m × 3 m walk-in cooler in the back with a 1.2 m door on its front
// (bottom) edge, a dairy case line, a gondola, an aerosol aisle, a line-set drop and a coil.
const store: Fixture[] = [
  {
    id: id(1),
    kind: "walk-in-cooler",
    label: "Dairy cooler",
    systemId: null,
    hasFans: true,
    polygon: rect(10, 0, 4, 3),
    door: { edge: 2, offset: 1, width: 1.2 },
  },
  { id: id(2), kind: "open-case", label: "Dairy 1", systemId: null, hasFans: true, polygon: rect(2, 5, 3.75, 1.1) },
  { id: id(3), kind: "gondola", label: "Aisle 4", systemId: null, hasFans: false, polygon: rect(2, 9, 10, 1.2) },
  {
    id: id(4),
    kind: "benign-zone",
    label: "Aerosols",
    systemId: null,
    hasFans: false,
    polygon: rect(2, 10.2, 2, 1),
    note: "aerosol storage",
    typicalPpm: 4,
  },
  { id: id(5), kind: "line-set-drop", label: "Drop A", systemId: null, hasFans: false, point: { x: 4, y: 5 } },
  { id: id(6), kind: "coil", label: "Cooler coil", systemId: null, hasFans: false, point: { x: 12, y: 0.5 } },
  {
    id: id(7),
    kind: "walk-in-freezer",
    label: "Freezer",
    systemId: null,
    hasFans: false,
    polygon: rect(15, 0, 3, 3),
    door: null,
  },
];

describe("roomWalls", () => {
  it("leaves the door gap open and seals every other stretch", () => {
    // Edge 2 runs from (14, 3) to (10, 3); the door covers 1..2.2 m along it, x from 13 down to 11.8.
    const walls = roomWalls(rect(10, 0, 4, 3), { edge: 2, offset: 1, width: 1.2 }, 0.1);
    expect(walls).toHaveLength(5);
    expect(blocked(walls, [12.4, 3])).toBe(false); // the middle of the door
    expect(blocked(walls, [12.95, 3])).toBe(false); // just inside the door's edge
    expect(blocked(walls, [13.05, 3])).toBe(true); // just beside it
    expect(blocked(walls, [11.75, 3])).toBe(true);
    expect(blocked(walls, [10, 1.5])).toBe(true);
    expect(blocked(walls, [14.04, -0.04])).toBe(true); // the corner's cap
    expect(blocked(walls, [12, 1.5])).toBe(false); // inside the room is air
    // Wall area: perimeter 14 m less the 1.2 m door, × 0.1 m, plus 4 corner caps of 0.05 × 0.1 m each side.
    const area = walls.reduce((s, w) => s + polygonArea(w), 0);
    expect(area).toBeCloseTo((14 - 1.2) * 0.1 + 8 * 0.05 * 0.1, 12);
  });
  it("closes a re-entrant corner of an L-shaped room", () => {
    const walls = roomWalls(
      [
        [0, 0],
        [4, 0],
        [4, 1],
        [1, 1],
        [1, 4],
        [0, 4],
      ],
      null,
      0.1,
    );
    expect(blocked(walls, [1.04, 1.04])).toBe(true);
    expect(blocked(walls, [0.96, 0.96])).toBe(true);
  });
});

describe("toLocatorPlan", () => {
  it("sorts fixtures into the contract's obstacles, fixtures, risk points and background zones", () => {
    const plan = toLocatorPlan({ width: 30, height: 20 }, store, { fansRunning: true });
    expect(plan.width).toBe(30);
    expect(plan.fixtures.map((f) => [f.id, f.kind, f.fans])).toEqual([
      [id(1), "walk-in", true],
      [id(2), "open-case", true],
      [id(7), "walk-in", false],
    ]);
    expect(plan.riskPoints).toEqual([
      { id: id(5), kind: "line-set", x: 4, y: 5 },
      { id: id(6), kind: "coil", x: 12, y: 0.5 },
    ]);
    expect(plan.backgroundZones).toEqual([
      { id: id(4), polygon: rect(2, 10.2, 2, 1), note: "aerosol storage", ppm: 4 },
    ]);
    const ids = plan.obstacles.map((o) => o.id);
    expect(ids.filter((o) => o.startsWith(`${id(1)}:wall:`))).toHaveLength(5); // 3 whole walls + 2 beside the door
    expect(ids.filter((o) => o.startsWith(`${id(7)}:wall:`))).toHaveLength(4); // no door marked: sealed
    expect(ids).toContain(id(3));
    // Walls along the plan's top edge are clipped to it.
    expect(plan.obstacles.every((o) => o.polygon.every(([x, y]) => x >= 0 && y >= 0 && x <= 30 && y <= 20))).toBe(true);
  });
  it("turns fans off for every fixture when the sweep says they were stopped", () => {
    const plan = toLocatorPlan({ width: 30, height: 20 }, store, { fansRunning: false });
    expect(plan.fixtures.every((f) => f.fans === false)).toBe(true);
  });
  it("omits ppm when a benign zone has no typical reading", () => {
    const zone = { ...(store[3] as Extract<Fixture, { kind: "benign-zone" }>), typicalPpm: null };
    expect(toLocatorPlan({ width: 30, height: 20 }, [zone], { fansRunning: true }).backgroundZones[0]).toEqual({
      id: id(4),
      polygon: rect(2, 10.2, 2, 1),
      note: "aerosol storage",
    });
  });
});
