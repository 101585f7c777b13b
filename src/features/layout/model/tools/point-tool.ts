/** Point tool: each press places one point fixture (line-set drop, valve, coil) at the snapped position. */
import type { PointKind } from "#core/contracts/fixture-kinds";
import { add } from "../actions";
import { newFixture } from "../new-fixture";
import { result, type ToolContext, type ToolEvent, type ToolResult } from "./tool";

export type PointToolState = { phase: "idle" };
export const POINT_IDLE: PointToolState = { phase: "idle" };

export function pointTool(
  kind: PointKind,
  state: PointToolState,
  event: ToolEvent,
  ctx: ToolContext,
): ToolResult<PointToolState> {
  if (event.type !== "pointer-down") return result(state);
  const p = ctx.snap(event.point);
  if (p.x < 0 || p.y < 0 || p.x > ctx.scene.plan.width || p.y > ctx.scene.plan.height) {
    return result(state, [], null, "Points go on the plan; this spot is outside it.");
  }
  return result(state, [add([newFixture(kind, ctx.newId(), { point: p })])]);
}
