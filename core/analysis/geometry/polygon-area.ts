import type { Polygon } from "./types";

/** Signed area by the shoelace formula (positive when the vertices run clockwise in a y-down plan). */
export function signedArea(polygon: Polygon): number {
  let twice = 0;
  for (let i = 0, n = polygon.length; i < n; i++) {
    const [x1, y1] = polygon[i];
    const [x2, y2] = polygon[(i + 1) % n];
    twice += x1 * y2 - x2 * y1;
  }
  return twice / 2;
}

export function polygonArea(polygon: Polygon): number {
  return Math.abs(signedArea(polygon));
}

/** Area-weighted centroid; falls back to the vertex mean for degenerate (zero-area) polygons. */
export function polygonCentroid(polygon: Polygon): [number, number] {
  const a = signedArea(polygon);
  if (Math.abs(a) < 1e-12) {
    const n = polygon.length;
    return [polygon.reduce((s, p) => s + p[0], 0) / n, polygon.reduce((s, p) => s + p[1], 0) / n];
  }
  let cx = 0;
  let cy = 0;
  for (let i = 0, n = polygon.length; i < n; i++) {
    const [x1, y1] = polygon[i];
    const [x2, y2] = polygon[(i + 1) % n];
    const cross = x1 * y2 - x2 * y1;
    cx += (x1 + x2) * cross;
    cy += (y1 + y2) * cross;
  }
  return [cx / (6 * a), cy / (6 * a)];
}
