/**
 * Where a duplicate lands: butted against the original on its right (the next case in a
 * row), else below it, else a small step down-right — always on the plan when it can be.
 */
import type { Vec } from "#core/analysis/geometry/types";
import { unionBounds } from "./fixture-geometry";
import type { Scene } from "./scene";

export const SMALL_STEP_M = 0.5;

export function duplicateOffset(scene: Scene, ids: readonly string[]): Vec {
  const b = unionBounds(ids.map((id) => scene.fixtures[id]).filter((f) => f !== undefined));
  if (!b) return [0, 0];
  const w = b.maxX - b.minX;
  const h = b.maxY - b.minY;
  // A point has no size: step it aside so the copy can be seen and picked.
  if (w === 0 && h === 0) return b.maxX + SMALL_STEP_M <= scene.plan.width ? [SMALL_STEP_M, 0] : [-SMALL_STEP_M, 0];
  if (b.maxX + w <= scene.plan.width) return [w, 0];
  if (b.maxY + h <= scene.plan.height) return [0, h];
  if (b.minX - w >= 0) return [-w, 0];
  if (b.minY - h >= 0) return [0, -h];
  return [Math.min(SMALL_STEP_M, scene.plan.width - b.maxX), Math.min(SMALL_STEP_M, scene.plan.height - b.maxY)];
}
