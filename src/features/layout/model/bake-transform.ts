/**
 * Baking a view's transform into plan geometry. A Konva Transformer (or any drag) leaves its
 * result on the node as a 2-D affine matrix [a, b, c, d, e, f] (x' = a·x + c·y + e,
 * y' = b·x + d·y + f, the canvas convention of CanvasRenderingContext2D.setTransform). The
 * editor reads it on transform end, maps the vertices through it here, and resets the node,
 * so the scene only ever holds plain vertices with any rotation and scale baked in.
 */
import type { Vertex } from "../../../../server/contracts/fixtures";

export type Affine = readonly [a: number, b: number, c: number, d: number, e: number, f: number];

export function applyAffine(m: Affine, [x, y]: readonly [number, number]): Vertex {
  return [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];
}

/**
 * The vertices after the transform, checked: a matrix that folds the outline flat (a
 * determinant of 0) or contains NaN is refused with a RangeError, since it would save a
 * polygon with no area. A mirror (negative determinant) keeps the outline valid.
 */
export function bakeAffine(polygon: readonly (readonly [number, number])[], m: Affine): Vertex[] {
  if (!m.every(Number.isFinite)) throw new RangeError("the transform must be finite numbers");
  const det = m[0] * m[3] - m[1] * m[2];
  if (Math.abs(det) < 1e-12) throw new RangeError("the transform squashes the outline flat; resize it to a width and depth above 0");
  return polygon.map((p) => applyAffine(m, p));
}

/** The matrix of a Konva node: translate (x, y) · rotate (degrees, clockwise on y-down) · scale. */
export function nodeAffine(x: number, y: number, rotationDeg: number, scaleX: number, scaleY: number): Affine {
  const r = (rotationDeg * Math.PI) / 180;
  const cos = Math.cos(r);
  const sin = Math.sin(r);
  return [cos * scaleX, sin * scaleX, -sin * scaleY, cos * scaleY, x, y];
}
