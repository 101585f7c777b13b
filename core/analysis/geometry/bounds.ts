import type { Bounds, Polygon, Vec } from "./types";

export function polygonBounds(points: Polygon): Bounds {
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  for (const [x, y] of points) {
    if (x < minX) minX = x;
    if (y < minY) minY = y;
    if (x > maxX) maxX = x;
    if (y > maxY) maxY = y;
  }
  return { minX, minY, maxX, maxY };
}

export function insideRect(point: Vec, width: number, height: number, tolerance = 0): boolean {
  return (
    point[0] >= -tolerance && point[1] >= -tolerance && point[0] <= width + tolerance && point[1] <= height + tolerance
  );
}
