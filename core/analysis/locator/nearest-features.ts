import type { LocatorFixture, LocatorRiskPoint } from "../../contracts/locator-input";
import { pointInPolygon } from "../geometry/point-in-polygon";
import { distanceToPolygonEdge } from "../geometry/segments";

export interface Nearest<T> {
  item: T;
  distance: number;
}

/** The fixture containing (x, y), or else the one whose outline is nearest (within maxM). */
export function nearestFixture(
  fixtures: readonly LocatorFixture[],
  x: number,
  y: number,
  maxM = 3,
): Nearest<LocatorFixture> | null {
  let best: Nearest<LocatorFixture> | null = null;
  for (const f of fixtures) {
    const d = pointInPolygon([x, y], f.polygon) ? 0 : distanceToPolygonEdge([x, y], f.polygon);
    if (d <= maxM && (!best || d < best.distance)) best = { item: f, distance: d };
  }
  return best;
}

/** The nearest line-set drop, valve or coil within maxM (straight-line distance). */
export function nearestRiskPoint(
  points: readonly LocatorRiskPoint[],
  x: number,
  y: number,
  maxM = 5,
): Nearest<LocatorRiskPoint> | null {
  let best: Nearest<LocatorRiskPoint> | null = null;
  for (const p of points) {
    const d = Math.hypot(p.x - x, p.y - y);
    if (d <= maxM && (!best || d < best.distance)) best = { item: p, distance: d };
  }
  return best;
}
