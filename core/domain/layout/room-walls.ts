/**
 * A room's outline as walls: thin rectangles centred on each edge, with the door's stretch of
 * its edge left open. Each wall runs half a thickness past the corners it ends at (a square
 * cap), so neighbouring walls overlap at every corner, convex or re-entrant, and no grid
 * sampling can find a crack there. At the door the wall stops flush, leaving the door's
 * full width open (a door starting right at a corner loses up to half a thickness to the
 * neighbouring wall's cap).
 */
import type { Vec } from "../../analysis/geometry/types";

export interface RoomDoorGap {
  edge: number;
  offset: number;
  width: number;
}

/** Stretches [start, end] metres along each edge that stay wall. */
function wallPieces(length: number, gap: RoomDoorGap | null): [number, number][] {
  if (!gap) return [[0, length]];
  const from = Math.max(0, Math.min(length, gap.offset));
  const to = Math.max(0, Math.min(length, gap.offset + gap.width));
  return (
    [
      [0, from],
      [to, length],
    ] as [number, number][]
  ).filter(([s, e]) => e - s > 1e-9);
}

export function roomWalls(polygon: readonly Vec[], door: RoomDoorGap | null, thickness: number): [number, number][][] {
  if (!(Number.isFinite(thickness) && thickness > 0))
    throw new RangeError(`wall thickness must be more than 0 m, got ${thickness}`);
  const half = thickness / 2;
  const walls: [number, number][][] = [];
  for (let i = 0, n = polygon.length; i < n; i++) {
    const a = polygon[i];
    const b = polygon[(i + 1) % n];
    const length = Math.hypot(b[0] - a[0], b[1] - a[1]);
    if (length === 0) continue;
    const ux = (b[0] - a[0]) / length;
    const uy = (b[1] - a[1]) / length;
    const nx = -uy * half;
    const ny = ux * half;
    for (const [s, e] of wallPieces(length, door && door.edge === i ? door : null)) {
      const s0 = s === 0 ? -half : s;
      const e0 = e === length ? length + half : e;
      const p: Vec = [a[0] + ux * s0, a[1] + uy * s0];
      const q: Vec = [a[0] + ux * e0, a[1] + uy * e0];
      walls.push([
        [p[0] + nx, p[1] + ny],
        [q[0] + nx, q[1] + ny],
        [q[0] - nx, q[1] - ny],
        [p[0] - nx, p[1] - ny],
      ]);
    }
  }
  return walls;
}
