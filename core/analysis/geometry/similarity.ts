import type { Vec } from "./types";

/** x' = s·R(θ)·x + t: the alignment stored between two plan versions. */
export interface Similarity {
  scale: number;
  rotation: number; // radians, positive turning x towards y (clockwise on a y-down plan)
  tx: number;
  ty: number;
}

export const IDENTITY: Similarity = { scale: 1, rotation: 0, tx: 0, ty: 0 };

export function applySimilarity(t: Similarity, [x, y]: Vec): [number, number] {
  const c = Math.cos(t.rotation) * t.scale;
  const s = Math.sin(t.rotation) * t.scale;
  return [c * x - s * y + t.tx, s * x + c * y + t.ty];
}

export function invertSimilarity(t: Similarity): Similarity {
  const scale = 1 / t.scale;
  const rotation = -t.rotation;
  const c = Math.cos(rotation) * scale;
  const s = Math.sin(rotation) * scale;
  return { scale, rotation, tx: -(c * t.tx - s * t.ty), ty: -(s * t.tx + c * t.ty) };
}

/**
 * The unique similarity that sends a1→b1 and a2→b2 (two matched points fix offset,
 * rotation and scale). Treats points as complex numbers: b = m·a + t with m = (b2−b1)/(a2−a1).
 */
export function similarityFromTwoPoints(a1: Vec, a2: Vec, b1: Vec, b2: Vec): Similarity {
  const ax = a2[0] - a1[0];
  const ay = a2[1] - a1[1];
  const bx = b2[0] - b1[0];
  const by = b2[1] - b1[1];
  const den = ax * ax + ay * ay;
  if (den === 0) throw new Error("the two matched points of the earlier version coincide");
  if (bx === 0 && by === 0) throw new Error("the two matched points of the later version coincide");
  const mr = (bx * ax + by * ay) / den;
  const mi = (by * ax - bx * ay) / den;
  const scale = Math.hypot(mr, mi);
  const rotation = Math.atan2(mi, mr);
  return { scale, rotation, tx: b1[0] - (mr * a1[0] - mi * a1[1]), ty: b1[1] - (mi * a1[0] + mr * a1[1]) };
}

export function composeSimilarity(first: Similarity, then: Similarity): Similarity {
  const [tx, ty] = applySimilarity(then, [first.tx, first.ty]);
  return { scale: first.scale * then.scale, rotation: first.rotation + then.rotation, tx, ty };
}
