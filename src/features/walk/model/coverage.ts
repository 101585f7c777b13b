import type { Fixture } from "#core/contracts/fixtures";
import { AIR_VOLUME_KINDS, POINT_KINDS } from "#core/contracts/fixture-kinds";
import { pointInPolygon } from "#core/analysis/geometry/point-in-polygon";
import { distanceToPolygonEdge } from "#core/analysis/geometry/segments";

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

function reach(f: Fixture, within: number): [number, number, number, number] {
  const pts = "point" in f ? [[f.point.x, f.point.y]] : f.polygon;
  let x0 = Infinity,
    y0 = Infinity,
    x1 = -Infinity,
    y1 = -Infinity;
  for (const [x, y] of pts) {
    x0 = Math.min(x0, x);
    y0 = Math.min(y0, y);
    x1 = Math.max(x1, x);
    y1 = Math.max(y1, y);
  }
  return [x0 - within, y0 - within, x1 + within, y1 + within];
}

/** The sampleable fixtures no reading has reached yet (a box test first: thousands of readings). */
export function unsampledFixtures(
  fixtures: readonly Fixture[],
  readings: readonly { x: number; y: number }[],
): Fixture[] {
  return fixtures.filter((f) => {
    if (!isSampleable(f)) return false;
    const [x0, y0, x1, y1] = reach(f, SAMPLED_WITHIN_M);
    return !readings.some((r) => r.x >= x0 && r.x <= x1 && r.y >= y0 && r.y <= y1 && isNear(f, r.x, r.y));
  });
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
