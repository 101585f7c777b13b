/** A freshly drawn fixture of a kind, with that kind's default properties. */
import { polygonBounds } from "#core/analysis/geometry/bounds";
import { FIXTURE_FAMILY, isPointKind, isRoomKind, type FixtureKind } from "#core/contracts/fixture-kinds";
import type { Fixture, Vertex } from "#core/contracts/fixtures";
import type { PlanPoint } from "../../../lib/plan-view/coordinates";

/**
 * Width of one glass door of a reach-in case, to guess the door count from the case length
 * (about 30 in, 0.76 m; common practice, no published source). The lead tech corrects it.
 */
export const TYPICAL_DOOR_WIDTH_M = 0.76;

export type FixtureGeometry = { polygon: readonly Vertex[] } | { point: PlanPoint };

/** Cases and walk-ins usually have fans (evaporator or air-curtain fans); other kinds do not. */
function defaultHasFans(kind: FixtureKind): boolean {
  return FIXTURE_FAMILY[kind] === "air-volume" && kind !== "machine-room";
}

export function newFixture(kind: FixtureKind, id: string, geometry: FixtureGeometry, label = ""): Fixture {
  const base = { id, label, systemId: null, hasFans: defaultHasFans(kind) };
  if (isPointKind(kind)) {
    if (!("point" in geometry)) throw new RangeError(`a ${kind} is a point, not an outline`);
    return { ...base, kind, point: { x: geometry.point.x, y: geometry.point.y } };
  }
  if (!("polygon" in geometry)) throw new RangeError(`a ${kind} needs an outline, not a point`);
  const polygon = geometry.polygon.map(([x, y]): Vertex => [x, y]);
  if (isRoomKind(kind)) return { ...base, kind, polygon, door: null };
  if (kind === "door-case") {
    const b = polygonBounds(polygon);
    const length = Math.max(b.maxX - b.minX, b.maxY - b.minY);
    return { ...base, kind, polygon, doorCount: Math.max(1, Math.round(length / TYPICAL_DOOR_WIDTH_M)) };
  }
  if (kind === "benign-zone") return { ...base, kind, polygon, note: "", typicalPpm: null };
  return { ...base, kind, polygon };
}
