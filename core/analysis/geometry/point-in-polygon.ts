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

/** A polygon's vertices as two arrays, for testing many points against it (`pointInVertices`). */
export interface VertexArrays {
  readonly xs: Float64Array;
  readonly ys: Float64Array;
}

export function vertexArrays(polygon: Polygon): VertexArrays {
  return { xs: Float64Array.from(polygon, (p) => p[0]), ys: Float64Array.from(polygon, (p) => p[1]) };
}

/**
 * pointInPolygon on vertex arrays: the same test, term for term, so the same answer, without a point
 * array per call (a plan's raster tests every cell of every solid body this way).
 */
export function pointInVertices(x: number, y: number, { xs, ys }: VertexArrays): boolean {
  let inside = false;
  const n = xs.length;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    const xi = xs[i];
    const yi = ys[i];
    const xj = xs[j];
    const yj = ys[j];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}
