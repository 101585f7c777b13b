import { GeodesicSearch } from "./geodesic-distance";
import { cellCentre, nearestFreeCell, segmentBlocked } from "./plan-grid";

export type PathPoint = [number, number];

/**
 * The walked route between two positions: the straight segment when it crosses no solid body,
 * otherwise the grid shortest path around the bodies (cell centres between the exact end points).
 * Returns null when b cannot be reached within `maxDetour` metres of walking.
 */
export function routeBetween(
  search: GeodesicSearch,
  ax: number,
  ay: number,
  bx: number,
  by: number,
  maxDetour: number,
): PathPoint[] | null {
  const grid = search.grid;
  if (!segmentBlocked(grid, ax, ay, bx, by))
    return [
      [ax, ay],
      [bx, by],
    ];
  const target = nearestFreeCell(grid, bx, by);
  if (target < 0) return null;
  search.fromPoint(ax, ay, maxDetour, target);
  if (search.dist[target] === Infinity) return null;
  const cells: number[] = [];
  for (let k = target; k >= 0; k = search.parent[k]) cells.push(k);
  cells.reverse();
  const out: PathPoint[] = [[ax, ay]];
  for (const k of cells) out.push(cellCentre(grid, k));
  out.push([bx, by]);
  return simplify(out);
}

/** Drops collinear interior points so the route is a short polyline. */
function simplify(points: PathPoint[]): PathPoint[] {
  if (points.length <= 2) return points;
  const out: PathPoint[] = [points[0]];
  for (let i = 1; i < points.length - 1; i++) {
    const a = out[out.length - 1];
    const b = points[i];
    const c = points[i + 1];
    const cross = (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]);
    if (Math.abs(cross) > 1e-9) out.push(b);
  }
  out.push(points[points.length - 1]);
  return out;
}
