import type { Bounds, Polygon, Vec } from "./types";

/** Small rigid and affine maps of outlines; results are fresh mutable arrays. */

export function translatePolygon(polygon: Polygon, dx: number, dy: number): [number, number][] {
  return polygon.map(([x, y]) => [x + dx, y + dy]);
}

/** Rotates about a pivot by `angle` radians, positive turning x towards y (clockwise on a y-down plan). */
export function rotatePoint([x, y]: Vec, [px, py]: Vec, angle: number): [number, number] {
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  const dx = x - px;
  const dy = y - py;
  return [px + c * dx - s * dy, py + s * dx + c * dy];
}

export function rotatePolygon(polygon: Polygon, pivot: Vec, angle: number): [number, number][] {
  return polygon.map((p) => rotatePoint(p, pivot, angle));
}

/**
 * Maps a point from one box onto another, axis by axis (how a resize handle stretches an
 * outline). A zero-size source axis maps to the target's start on that axis.
 */
export function mapBoxPoint([x, y]: Vec, from: Bounds, to: Bounds): [number, number] {
  const fw = from.maxX - from.minX;
  const fh = from.maxY - from.minY;
  const u = fw === 0 ? 0 : (x - from.minX) / fw;
  const v = fh === 0 ? 0 : (y - from.minY) / fh;
  return [to.minX + u * (to.maxX - to.minX), to.minY + v * (to.maxY - to.minY)];
}
