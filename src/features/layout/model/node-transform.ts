/**
 * Baking a canvas node's transform into plan vertices. The view draws each outline with its
 * vertices as points in plan metres and the node at the origin; after a Transformer gesture
 * the node carries x, y, scaleX, scaleY and rotation instead. On transform end the view
 * passes them here, records setVertices with the result, and resets the node to identity,
 * so the model only ever holds vertices (react-konva's advice: bake the scale, don't keep it).
 */
import type { Vertex } from "#core/contracts/fixtures";

/** Konva's node attributes in plan metres; rotation in degrees, clockwise on the y-down plan. */
export interface NodeTransform {
  x: number;
  y: number;
  scaleX: number;
  scaleY: number;
  rotation: number;
}

/** p' = (x, y) + R(rotation) · (scaleX · px, scaleY · py), Konva's order for an unskewed node. */
export function bakeNodeTransform(polygon: readonly Vertex[], t: NodeTransform): Vertex[] {
  if (![t.x, t.y, t.scaleX, t.scaleY, t.rotation].every(Number.isFinite))
    throw new RangeError("node transform values must be finite numbers");
  if (t.scaleX === 0 || t.scaleY === 0) throw new RangeError("node scale must not be 0 (the outline would collapse)");
  const a = (t.rotation * Math.PI) / 180;
  const c = Math.cos(a);
  const s = Math.sin(a);
  return polygon.map(([px, py]) => {
    const sx = px * t.scaleX;
    const sy = py * t.scaleY;
    return [t.x + c * sx - s * sy, t.y + s * sx + c * sy];
  });
}
