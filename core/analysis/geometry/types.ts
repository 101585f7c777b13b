// Plan coordinates: metres, origin at the plan's top-left corner, x right, y down.
// Pixels and screen points have their own types in the client's coordinate module.
export type Vec = readonly [number, number];
export type Polygon = readonly Vec[];

export interface Bounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}
