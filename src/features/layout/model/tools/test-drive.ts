/** Test helper: feeds a tool a list of events and collects what it emitted. */
import type { SceneAction } from "../actions";
import { planPoint } from "../../../../lib/plan-view/coordinates";
import { createScene, type Scene } from "../scene";
import { idSource } from "../test-builders";
import type { ToolContext, ToolEvent, ToolResult } from "./tool";

export const down = (x: number, y: number, shift = false): ToolEvent => ({
  type: "pointer-down",
  point: planPoint(x, y),
  shift,
});
export const moveTo = (x: number, y: number): ToolEvent => ({ type: "pointer-move", point: planPoint(x, y) });
export const up = (x: number, y: number): ToolEvent => ({ type: "pointer-up", point: planPoint(x, y) });
export const dbl = (x: number, y: number): ToolEvent => ({ type: "double-click", point: planPoint(x, y) });
export const key = (k: string): ToolEvent => ({ type: "key", key: k });

export function plainContext(scene: Scene = createScene({ width: 40, height: 20 })): ToolContext {
  return {
    scene,
    newId: idSource(),
    snap: (p) => p,
    snapMove: (_ids, dx, dy) => ({ dx, dy }),
    dragThresholdM: 0.05,
    pickToleranceM: 0.2,
  };
}

export function drive<S>(
  reduce: (s: S, e: ToolEvent, c: ToolContext) => ToolResult<S>,
  initial: S,
  events: ToolEvent[],
  ctx: ToolContext,
) {
  let state = initial;
  const actions: SceneAction[] = [];
  let last: ToolResult<S> | null = null;
  for (const e of events) {
    last = reduce(state, e, ctx);
    state = last.state;
    actions.push(...last.actions);
  }
  return { state, actions, last: last! };
}
