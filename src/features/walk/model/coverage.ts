import type { Fixture } from "../../../../server/contracts/fixtures";
import { AIR_VOLUME_KINDS, POINT_KINDS } from "../../../../server/contracts/fixture-kinds";
import { pointInPolygon } from "../../../../server/analysis/geometry/point-in-polygon";
import { distanceToPolygonEdge } from "../../../../server/analysis/geometry/segments";

/**
 * A fixture counts as sampled when a reading lies inside it or within this distance of its
 * outline: a probe held at a case front is a hand's reach from the drawn edge (our own figure).
 */
export const SAMPLED_WITHIN_M = 1;

const SAMPLED_KINDS = new Set<string>([...AIR_VOLUME_KINDS, ...POINT_KINDS]);

/** Fixtures where readings belong (air volumes and leak-prone points). */
export function isSampleable(f: Fixture): boolean {
  return SAMPLED_KINDS.has(f.kind);
}

export function isNear(f: Fixture, x: number, y: number, within = SAMPLED_WITHIN_M): boolean {
  if ("point" in f) return Math.hypot(f.point.x - x, f.point.y - y) <= within;
  return pointInPolygon([x, y], f.polygon) || distanceToPolygonEdge([x, y], f.polygon) <= within;
}

/** Ids of the sampleable fixtures no reading has reached yet. */
export function unsampledFixtures(fixtures: readonly Fixture[], readings: readonly { x: number; y: number }[]): Fixture[] {
  return fixtures.filter((f) => isSampleable(f) && !readings.some((r) => isNear(f, r.x, r.y)));
}

/** The fixture a point falls in (rooms and cases), or the nearest sampleable one within reach. */
export function fixtureAt(fixtures: readonly Fixture[], x: number, y: number): Fixture | null {
  const inside = fixtures.find((f) => !("point" in f) && isSampleable(f) && pointInPolygon([x, y], f.polygon));
  if (inside) return inside;
  let best: Fixture | null = null;
  let bestD = SAMPLED_WITHIN_M;
  for (const f of fixtures) {
    if (!isSampleable(f)) continue;
    const d = "point" in f ? Math.hypot(f.point.x - x, f.point.y - y) : distanceToPolygonEdge([x, y], f.polygon);
    if (d <= bestD) {
      best = f;
      bestD = d;
    }
  }
  return best;
}
