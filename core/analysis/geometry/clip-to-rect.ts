import type { Polygon } from "./types";

/**
 * Clips a polygon to the rectangle [0, width] × [0, height] by Sutherland–Hodgman
 * (Sutherland & Hodgman, "Reentrant polygon clipping", CACM 17(1), 1974). Exact for convex
 * clip regions such as the plan's rectangle. Returns [] when nothing is left.
 */
export function clipPolygonToRect(polygon: Polygon, width: number, height: number): [number, number][] {
  type Edge = {
    inside: (p: readonly [number, number]) => boolean;
    cut: (a: readonly [number, number], b: readonly [number, number]) => [number, number];
  };
  const atX =
    (x0: number) =>
    (a: readonly [number, number], b: readonly [number, number]): [number, number] => [
      x0,
      a[1] + ((b[1] - a[1]) * (x0 - a[0])) / (b[0] - a[0]),
    ];
  const atY =
    (y0: number) =>
    (a: readonly [number, number], b: readonly [number, number]): [number, number] => [
      a[0] + ((b[0] - a[0]) * (y0 - a[1])) / (b[1] - a[1]),
      y0,
    ];
  const edges: Edge[] = [
    { inside: (p) => p[0] >= 0, cut: atX(0) },
    { inside: (p) => p[0] <= width, cut: atX(width) },
    { inside: (p) => p[1] >= 0, cut: atY(0) },
    { inside: (p) => p[1] <= height, cut: atY(height) },
  ];
  let out: [number, number][] = polygon.map(([x, y]) => [x, y]);
  for (const edge of edges) {
    const input = out;
    out = [];
    for (let i = 0; i < input.length; i++) {
      const cur = input[i];
      const prev = input[(i + input.length - 1) % input.length];
      const curIn = edge.inside(cur);
      if (curIn !== edge.inside(prev)) out.push(edge.cut(prev, cur));
      if (curIn) out.push(cur);
    }
    if (out.length === 0) return [];
  }
  return out;
}
