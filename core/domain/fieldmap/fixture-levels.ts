/**
 * Peak and mean ppm of a field around one fixture: the known cells whose centre lies inside the
 * fixture's outline or within `marginM` of it (readings are taken at the case fronts, just outside).
 */
import { pointInPolygon } from "../../analysis/geometry/point-in-polygon";
import { distanceToPolygonEdge } from "../../analysis/geometry/segments";
import type { Polygon } from "../../analysis/geometry/types";
import { isKnown, type FieldGridLike } from "./field-grid";

export interface FixtureLevel {
  peakPpm: number;
  meanPpm: number;
  cells: number;
}

export const FIXTURE_MARGIN_M = 0.75;

export function fixtureLevel(grid: FieldGridLike, polygon: Polygon, marginM = FIXTURE_MARGIN_M): FixtureLevel | null {
  if (polygon.length < 3) throw new RangeError(`polygon: needs at least 3 vertices, got ${polygon.length}`);
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  for (const [x, y] of polygon) {
    minX = Math.min(minX, x);
    minY = Math.min(minY, y);
    maxX = Math.max(maxX, x);
    maxY = Math.max(maxY, y);
  }
  const s = grid.cellSize;
  const i0 = Math.max(0, Math.floor((minX - marginM) / s));
  const i1 = Math.min(grid.width - 1, Math.floor((maxX + marginM) / s));
  const j0 = Math.max(0, Math.floor((minY - marginM) / s));
  const j1 = Math.min(grid.height - 1, Math.floor((maxY + marginM) / s));
  let peak = -Infinity;
  let sum = 0;
  let n = 0;
  for (let j = j0; j <= j1; j++) {
    for (let i = i0; i <= i1; i++) {
      const k = j * grid.width + i;
      if (!isKnown(grid, k)) continue;
      const c: [number, number] = [(i + 0.5) * s, (j + 0.5) * s];
      if (!pointInPolygon(c, polygon) && distanceToPolygonEdge(c, polygon) > marginM) continue;
      const v = grid.values[k];
      if (v > peak) peak = v;
      sum += v;
      n++;
    }
  }
  return n === 0 ? null : { peakPpm: peak, meanPpm: sum / n, cells: n };
}
