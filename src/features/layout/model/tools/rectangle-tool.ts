/**
 * Rectangle tool: idle → pointing (pressed) → dragging (past the drag threshold) → commit on
 * release, adding one axis-aligned fixture of `kind`. Escape cancels; a click without a drag
 * adds nothing.
 */
import type { FixtureKind } from "#core/contracts/fixture-kinds";
import { add } from "../actions";
import { planPoint, type PlanPoint } from "../../../../lib/plan-view/coordinates";
import { newFixture } from "../new-fixture";
import { boxOf, distance, result, type ToolContext, type ToolEvent, type ToolResult } from "./tool";

export type RectangleToolState =
  | { phase: "idle" }
  | { phase: "pointing"; start: PlanPoint }
  | { phase: "dragging"; start: PlanPoint; current: PlanPoint };

export const RECTANGLE_IDLE: RectangleToolState = { phase: "idle" };

function corners(a: PlanPoint, b: PlanPoint): PlanPoint[] {
  const box = boxOf(a, b);
  return [
    planPoint(box.minX, box.minY),
    planPoint(box.maxX, box.minY),
    planPoint(box.maxX, box.maxY),
    planPoint(box.minX, box.maxY),
  ];
}

export function rectangleTool(
  kind: FixtureKind,
  state: RectangleToolState,
  event: ToolEvent,
  ctx: ToolContext,
): ToolResult<RectangleToolState> {
  if (event.type === "key") return event.key === "Escape" ? result(RECTANGLE_IDLE) : result(state, [], preview(state));
  if (event.type === "double-click") return result(state, [], preview(state));
  if (event.type === "cancel") return result(RECTANGLE_IDLE);
  const p = ctx.snap(event.point);
  switch (state.phase) {
    case "idle":
      return event.type === "pointer-down" ? result({ phase: "pointing", start: p }) : result(state);
    case "pointing":
      if (event.type === "pointer-up") return result(RECTANGLE_IDLE);
      if (event.type === "pointer-move" && distance(event.point, state.start) > ctx.dragThresholdM) {
        const next: RectangleToolState = { phase: "dragging", start: state.start, current: p };
        return result(next, [], preview(next));
      }
      return result(state);
    case "dragging": {
      const next: RectangleToolState = { ...state, current: p };
      if (event.type !== "pointer-up") return result(next, [], preview(next));
      const box = boxOf(state.start, p);
      if (box.maxX - box.minX <= 0 || box.maxY - box.minY <= 0) {
        return result(RECTANGLE_IDLE, [], null, "The rectangle has no width or no depth; drag across both directions.");
      }
      const polygon = corners(state.start, p).map((c): [number, number] => [c.x, c.y]);
      return result(RECTANGLE_IDLE, [add([newFixture(kind, ctx.newId(), { polygon })])]);
    }
  }
}

function preview(state: RectangleToolState) {
  return state.phase === "dragging"
    ? { kind: "outline" as const, vertices: corners(state.start, state.current), closed: true, hover: null }
    : null;
}
