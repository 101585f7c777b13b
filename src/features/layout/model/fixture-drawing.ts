/**
 * Plain geometry the view draws from, kept out of the components so it can be tested: a
 * room's wall as an open line that leaves its door gap, and the door divisions of a
 * glass-door case along its longest edge.
 */
import type { RoomDoor, Vertex } from "#core/contracts/fixtures";
import { polygonCentroid } from "#core/analysis/geometry/polygon-area";

function lerp(a: Vertex, b: Vertex, t: number): Vertex {
  return [a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t];
}

/**
 * The wall of a room as one open polyline [x0, y0, x1, y1, …] that starts at the door's far
 * side, runs round every corner and ends at the door's near side; with no door (a sealed
 * room until one is marked) it is the closed outline.
 */
export function wallWithDoorGap(
  polygon: readonly Vertex[],
  door: RoomDoor | null,
): { points: number[]; closed: boolean } {
  const flat = (vs: readonly Vertex[]) => vs.flatMap(([x, y]) => [x, y]);
  if (!door || door.edge >= polygon.length) return { points: flat(polygon), closed: true };
  const n = polygon.length;
  const a = polygon[door.edge];
  const b = polygon[(door.edge + 1) % n];
  const length = Math.hypot(b[0] - a[0], b[1] - a[1]);
  if (length === 0) return { points: flat(polygon), closed: true };
  const near = lerp(a, b, door.offset / length);
  const far = lerp(a, b, Math.min(1, (door.offset + door.width) / length));
  const run: Vertex[] = [far];
  for (let k = 1; k <= n; k++) run.push(polygon[(door.edge + k) % n]);
  run.push(near);
  return { points: flat(run), closed: false };
}

/** The door gap's two ends, for drawing the door marker. */
export function doorGap(polygon: readonly Vertex[], door: RoomDoor): [Vertex, Vertex] | null {
  if (door.edge >= polygon.length) return null;
  const a = polygon[door.edge];
  const b = polygon[(door.edge + 1) % polygon.length];
  const length = Math.hypot(b[0] - a[0], b[1] - a[1]);
  if (length === 0) return null;
  return [lerp(a, b, door.offset / length), lerp(a, b, Math.min(1, (door.offset + door.width) / length))];
}

/**
 * Short ticks across the longest edge of a glass-door case, dividing it into `doorCount`
 * equal doors (the count is the lead tech's, the ticks only show it). Each tick runs square to
 * the edge, into the case, a quarter of the way to the centroid's distance from the edge.
 */
export function doorTicks(polygon: readonly Vertex[], doorCount: number): [Vertex, Vertex][] {
  if (polygon.length < 2 || !(Number.isInteger(doorCount) && doorCount >= 2)) return [];
  let best = 0;
  let bestLength = -1;
  for (let i = 0; i < polygon.length; i++) {
    const a = polygon[i];
    const b = polygon[(i + 1) % polygon.length];
    const l = Math.hypot(b[0] - a[0], b[1] - a[1]);
    if (l > bestLength) [best, bestLength] = [i, l];
  }
  const a = polygon[best];
  const b = polygon[(best + 1) % polygon.length];
  const c = polygonCentroid(polygon);
  const ux = (b[0] - a[0]) / bestLength;
  const uy = (b[1] - a[1]) / bestLength;
  // The unit normal, turned to face the centroid; its distance from the edge sets the tick length.
  let nx = -uy;
  let ny = ux;
  let depth = (c[0] - a[0]) * nx + (c[1] - a[1]) * ny;
  if (depth < 0) [nx, ny, depth] = [-nx, -ny, -depth];
  const len = depth * 0.5;
  const ticks: [Vertex, Vertex][] = [];
  for (let k = 1; k < doorCount; k++) {
    const p = lerp(a, b, k / doorCount);
    ticks.push([p, [p[0] + nx * len, p[1] + ny * len]]);
  }
  return ticks;
}
