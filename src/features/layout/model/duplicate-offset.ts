/**
 * Where a duplicate lands: beside the original — butted against its right (the next case in a
 * row), else below, left or above it — on the plan, and where it covers the fewest other
 * fixtures (a spot beside a wall or a neighbouring case beats one on top of them). A fixture
 * that holds the whole original (the room a case stands in) does not count against a spot.
 * With no room beside it on the plan, a small step down-right.
 */
import type { Bounds, Vec } from "#core/analysis/geometry/types";
import { fixtureBounds, unionBounds } from "./fixture-geometry";
import type { Scene } from "./scene";

export const SMALL_STEP_M = 0.5;

/** Overlap with an area (touching edges do not count: a butted copy touches its original). */
function overlaps(a: Bounds, b: Bounds): boolean {
  return a.minX < b.maxX && b.minX < a.maxX && a.minY < b.maxY && b.minY < a.maxY;
}

function contains(outer: Bounds, inner: Bounds): boolean {
  return outer.minX <= inner.minX && outer.minY <= inner.minY && outer.maxX >= inner.maxX && outer.maxY >= inner.maxY;
}

const shifted = (b: Bounds, [dx, dy]: Vec): Bounds => ({
  minX: b.minX + dx,
  minY: b.minY + dy,
  maxX: b.maxX + dx,
  maxY: b.maxY + dy,
});

export function duplicateOffset(scene: Scene, ids: readonly string[]): Vec {
  const chosen = new Set(ids);
  const b = unionBounds(ids.map((id) => scene.fixtures[id]).filter((f) => f !== undefined));
  if (!b) return [0, 0];
  const w = b.maxX - b.minX;
  const h = b.maxY - b.minY;
  // A point has no size: step it aside so the copy can be seen and picked.
  const candidates: Vec[] =
    w === 0 && h === 0
      ? [
          [SMALL_STEP_M, 0],
          [-SMALL_STEP_M, 0],
        ]
      : [
          [w, 0],
          [0, h],
          [-w, 0],
          [0, -h],
        ];
  const onPlan = candidates.filter(([dx, dy]) => {
    const c = shifted(b, [dx, dy]);
    return c.minX >= 0 && c.minY >= 0 && c.maxX <= scene.plan.width && c.maxY <= scene.plan.height;
  });
  if (onPlan.length === 0)
    return [Math.min(SMALL_STEP_M, scene.plan.width - b.maxX), Math.min(SMALL_STEP_M, scene.plan.height - b.maxY)];
  const others = scene.order
    .filter((id) => !chosen.has(id))
    .map((id) => fixtureBounds(scene.fixtures[id]))
    .filter((o) => !contains(o, b));
  const covered = (offset: Vec) => {
    const c = shifted(b, offset);
    return others.filter((o) => overlaps(c, o)).length;
  };
  // The first of the fewest: the order above breaks ties.
  return onPlan.reduce((best, next) => (covered(next) < covered(best) ? next : best));
}
