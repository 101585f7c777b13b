/**
 * Turns a plan's fixtures and a sweep's conditions into the locator's command-line contract
 * `plan` object (docs/locator/command-line.md): an external interchange format with fixed
 * short names, so the product's words are translated here and nowhere else.
 */
import { clipPolygonToRect } from "../../analysis/geometry/clip-to-rect";
import { FIXTURE_FAMILY, isRoomKind, type FixtureKind } from "../../contracts/fixture-kinds";
import type { Fixture, PlanBounds, Vertex } from "../../contracts/fixtures";
import type { LocatorFixtureKind, LocatorRiskPointKind } from "../../contracts/locator-input";
import { roomWalls } from "./room-walls";

/** Room walls as thin polygons: 0.1 m, a typical insulated walk-in panel (about 4 in; common practice, no published source). */
export const ROOM_WALL_THICKNESS_M = 0.1;

export interface LocatorPlan {
  width: number;
  height: number;
  obstacles: { id: string; polygon: [number, number][] }[];
  fixtures: { id: string; kind: LocatorFixtureKind; polygon: [number, number][]; fans: boolean }[];
  riskPoints: { id: string; kind: LocatorRiskPointKind; x: number; y: number }[];
  backgroundZones: { id: string; polygon: [number, number][]; note: string; ppm?: number }[];
}

/** What the sweep says about the air: fans running or stopped (e.g. for defrost). */
export interface SweepConditions {
  fansRunning: boolean;
}

/** The layout kinds the locator models as air volumes, and the locator kind of each. */
export const AIR_KIND: Partial<Record<FixtureKind, LocatorFixtureKind>> = {
  "open-case": "open-case",
  "island-case": "island-case",
  "door-case": "door-case",
  "walk-in-cooler": "walk-in",
  "walk-in-freezer": "walk-in",
  "machine-room": "machine-room",
};

const RISK_KIND: Partial<Record<FixtureKind, LocatorRiskPointKind>> = {
  "line-set-drop": "line-set",
  valve: "valve",
  coil: "coil",
};

const copy = (polygon: readonly Vertex[]): [number, number][] => polygon.map(([x, y]) => [x, y]);

/**
 * Builds the contract's `plan`. Fixtures are expected to have passed validateFixtureList for
 * this plan. Walls of walk-ins and machine rooms become obstacles `<fixture id>:wall:<k>`,
 * clipped to the plan; a room whose door is not yet marked is sealed.
 */
export function toLocatorPlan(
  plan: PlanBounds,
  fixtures: readonly Fixture[],
  conditions: SweepConditions,
  wallThickness = ROOM_WALL_THICKNESS_M,
): LocatorPlan {
  if (!(Number.isFinite(plan.width) && plan.width > 0 && Number.isFinite(plan.height) && plan.height > 0)) {
    throw new RangeError("plan width and height must be more than 0 m");
  }
  const out: LocatorPlan = {
    width: plan.width,
    height: plan.height,
    obstacles: [],
    fixtures: [],
    riskPoints: [],
    backgroundZones: [],
  };
  for (const f of fixtures) {
    if ("point" in f) {
      const kind = RISK_KIND[f.kind];
      if (kind) out.riskPoints.push({ id: f.id, kind, x: f.point.x, y: f.point.y });
      continue;
    }
    const family = FIXTURE_FAMILY[f.kind];
    if (family === "solid-body") out.obstacles.push({ id: f.id, polygon: copy(f.polygon) });
    if (f.kind === "benign-zone") {
      out.backgroundZones.push({
        id: f.id,
        polygon: copy(f.polygon),
        note: f.note,
        ...(f.typicalPpm === null ? {} : { ppm: f.typicalPpm }),
      });
    }
    const airKind = AIR_KIND[f.kind];
    if (airKind)
      out.fixtures.push({
        id: f.id,
        kind: airKind,
        polygon: copy(f.polygon),
        fans: f.hasFans && conditions.fansRunning,
      });
    if (isRoomKind(f.kind) && "door" in f) {
      roomWalls(f.polygon, f.door, wallThickness).forEach((wall, k) => {
        const clipped = clipPolygonToRect(wall, plan.width, plan.height);
        if (clipped.length >= 3) out.obstacles.push({ id: `${f.id}:wall:${k}`, polygon: clipped });
      });
    }
  }
  return out;
}
