import type { Polygon, Vec } from "./types";

/**
 * Even-odd ray casting (the crossing-number test, as in W. R. Franklin's PNPOLY).
 * Points exactly on an edge may fall either way; callers that care test the edge distance.
 */
export function pointInPolygon(point: Vec, polygon: Polygon): boolean {
  const [x, y] = point;
  let inside = false;
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i++) {
    const [xi, yi] = polygon[i];
    const [xj, yj] = polygon[j];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}
