/**
 * Geometry of one fixture as a whole: its bounds and centroid, and maps that move every
 * vertex (or the point) while keeping a room's door on its edge. Pure; returns new objects.
 */
import { polygonBounds } from "#core/analysis/geometry/bounds";
import { polygonCentroid } from "#core/analysis/geometry/polygon-area";
import { mapBoxPoint, rotatePoint } from "#core/analysis/geometry/transform";
import type { Bounds, Vec } from "#core/analysis/geometry/types";
import type { Fixture, RoomDoor, Vertex } from "#core/contracts/fixtures";

export function fixtureVertices(f: Fixture): Vertex[] {
  return "point" in f ? [[f.point.x, f.point.y]] : f.polygon.map(([x, y]) => [x, y]);
}

export function fixtureBounds(f: Fixture): Bounds {
  return polygonBounds(fixtureVertices(f));
}

/** The union of several fixtures' bounds, or null for none. */
export function unionBounds(fixtures: readonly Fixture[]): Bounds | null {
  if (fixtures.length === 0) return null;
  const all = fixtures.map(fixtureBounds);
  return {
    minX: Math.min(...all.map((b) => b.minX)),
    minY: Math.min(...all.map((b) => b.minY)),
    maxX: Math.max(...all.map((b) => b.maxX)),
    maxY: Math.max(...all.map((b) => b.maxY)),
  };
}

/** Area centroid of a polygon fixture; the point itself for a point fixture. */
export function fixtureCentroid(f: Fixture): [number, number] {
  return "point" in f ? [f.point.x, f.point.y] : polygonCentroid(f.polygon);
}

/**
 * Applies `map` to every vertex. `lengthScale` is how much the map stretches lengths
 * (1 for moves and rotations), applied to a door's offset and width.
 */
export function mapFixture<F extends Fixture>(f: F, map: (p: Vec) => [number, number], lengthScale = 1): F {
  if ("point" in f) {
    const [x, y] = map([f.point.x, f.point.y]);
    return { ...f, point: { x, y } };
  }
  const polygon = f.polygon.map(map);
  if ("door" in f && f.door) {
    const door = { ...f.door, offset: f.door.offset * lengthScale, width: f.door.width * lengthScale };
    return { ...f, polygon, door: fitDoor(door, polygon) };
  }
  return { ...f, polygon };
}

export function translateFixture<F extends Fixture>(f: F, dx: number, dy: number): F {
  return mapFixture(f, ([x, y]) => [x + dx, y + dy]);
}

export function rotateFixture<F extends Fixture>(f: F, pivot: Vec, angle: number): F {
  return mapFixture(f, (p) => rotatePoint(p, pivot, angle));
}

/** Scales about the plan origin (a re-calibration of the plan's image). */
export function scaleFixture<F extends Fixture>(f: F, factor: number): F {
  return mapFixture(f, ([x, y]) => [x * factor, y * factor], factor);
}

/**
 * Stretches the outline from its bounding box onto `box` (a resize handle). A room's door
 * keeps its centre at the same fraction along its edge and its width, shrunk if the edge is shorter.
 */
export function resizeFixture<F extends Fixture>(f: F, box: Bounds): F {
  const from = fixtureBounds(f);
  if ("point" in f) return mapFixture(f, () => [(box.minX + box.maxX) / 2, (box.minY + box.maxY) / 2]);
  if (!("door" in f) || !f.door) return mapFixture(f, (p) => mapBoxPoint(p, from, box));
  const polygon = f.polygon.map((p) => mapBoxPoint(p, from, box));
  return { ...f, polygon, door: relocateDoor(f.door, f.polygon, polygon) };
}

/**
 * Where a room's door goes when its outline's vertices are edited. With the same number of
 * vertices (a vertex dragged) it stays on the same edge at the same fraction along it; when
 * vertices were added or removed it goes to the edge nearest its old centre.
 */
export function relocateDoor(door: RoomDoor, before: readonly Vertex[], after: readonly Vertex[]): RoomDoor | null {
  if (door.edge >= before.length) return null;
  const oldLength = edgeLength(before, door.edge);
  const fraction = oldLength > 0 ? (door.offset + door.width / 2) / oldLength : 0.5;
  if (after.length === before.length) {
    const length = edgeLength(after, door.edge);
    return fitDoor({ ...door, offset: fraction * length - door.width / 2 }, after);
  }
  const a = before[door.edge];
  const b = before[(door.edge + 1) % before.length];
  const centre: Vec = [a[0] + (b[0] - a[0]) * fraction, a[1] + (b[1] - a[1]) * fraction];
  let best = { edge: 0, along: 0, d: Infinity };
  for (let i = 0; i < after.length; i++) {
    const p = after[i];
    const q = after[(i + 1) % after.length];
    const len = Math.hypot(q[0] - p[0], q[1] - p[1]);
    if (len === 0) continue;
    const t = Math.max(
      0,
      Math.min(len, ((centre[0] - p[0]) * (q[0] - p[0]) + (centre[1] - p[1]) * (q[1] - p[1])) / len),
    );
    const d = Math.hypot(p[0] + ((q[0] - p[0]) * t) / len - centre[0], p[1] + ((q[1] - p[1]) * t) / len - centre[1]);
    if (d < best.d) best = { edge: i, along: t, d };
  }
  return best.d === Infinity
    ? null
    : fitDoor({ edge: best.edge, offset: best.along - door.width / 2, width: door.width }, after);
}

export function edgeLength(polygon: readonly Vertex[], edge: number): number {
  const a = polygon[edge];
  const b = polygon[(edge + 1) % polygon.length];
  return Math.hypot(b[0] - a[0], b[1] - a[1]);
}

/**
 * Keeps a door valid after its outline changed: dropped if its edge no longer exists, narrowed
 * to the edge's length and slid back onto the edge.
 */
export function fitDoor(door: RoomDoor, polygon: readonly Vertex[]): RoomDoor | null {
  if (door.edge >= polygon.length) return null;
  const length = edgeLength(polygon, door.edge);
  if (length === 0) return null;
  const width = Math.min(door.width, length);
  const offset = Math.min(Math.max(0, door.offset), length - width);
  return { edge: door.edge, offset, width };
}
