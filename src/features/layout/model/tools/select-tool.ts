/**
 * Select/move tool. A press on a fixture selects it (Shift toggles it in the selection) and a
 * drag past the threshold moves the whole selection, previewed while dragging and recorded as
 * ONE move on release (the view writes back on drag end, as react-konva advises). A press on
 * empty plan starts a marquee: released after a drag it selects the fixtures wholly inside
 * (Shift adds them); released without one it clears the selection. Escape cancels a drag;
 * Delete or Backspace removes the selection.
 */
import { move, remove, select } from "../actions";
import type { PlanPoint } from "../../../../lib/plan-view/coordinates";
import { fixturesInBox, hitTest } from "../scene";
import { boxOf, distance, result, type ToolContext, type ToolEvent, type ToolResult } from "./tool";

export type SelectToolState =
  | { phase: "idle" }
  | { phase: "pressing"; start: PlanPoint; ids: readonly string[] }
  | { phase: "moving"; start: PlanPoint; ids: readonly string[]; dx: number; dy: number }
  | { phase: "marquee"; start: PlanPoint; current: PlanPoint; shift: boolean; dragged: boolean };

export const SELECT_IDLE: SelectToolState = { phase: "idle" };

type R = ToolResult<SelectToolState>;

function pressed(point: PlanPoint, shift: boolean, ctx: ToolContext): R {
  const { scene } = ctx;
  const hit = hitTest(scene, point, ctx.pickToleranceM);
  if (hit === null) return result({ phase: "marquee", start: point, current: point, shift, dragged: false });
  if (shift) {
    // Shift-pressing a selected fixture takes it out; dragging then moves nothing.
    const ids = scene.selection.includes(hit) ? [] : [...scene.selection, hit];
    return result({ phase: "pressing", start: point, ids }, [select([hit], "toggle")]);
  }
  if (scene.selection.includes(hit)) return result({ phase: "pressing", start: point, ids: scene.selection });
  return result({ phase: "pressing", start: point, ids: [hit] }, [select([hit])]);
}

function moving(
  state: { start: PlanPoint; ids: readonly string[] },
  point: PlanPoint,
  ctx: ToolContext,
): SelectToolState & { phase: "moving" } {
  const { dx, dy } = ctx.snapMove(state.ids, point.x - state.start.x, point.y - state.start.y);
  return { phase: "moving", start: state.start, ids: state.ids, dx, dy };
}

export function selectTool(state: SelectToolState, event: ToolEvent, ctx: ToolContext): R {
  if (event.type === "key") {
    if (event.key === "Escape") return state.phase === "idle" ? result(state, [select([])]) : result(SELECT_IDLE);
    if (
      (event.key === "Delete" || event.key === "Backspace") &&
      state.phase === "idle" &&
      ctx.scene.selection.length > 0
    ) {
      return result(state, [remove(ctx.scene.selection)]);
    }
    return result(state);
  }
  if (event.type === "double-click") return result(state);
  // A lost pointer ends a drag or a marquee; a selection made by the press stays.
  if (event.type === "cancel") return result(SELECT_IDLE);
  switch (state.phase) {
    case "idle":
      return event.type === "pointer-down" ? pressed(event.point, event.shift ?? false, ctx) : result(state);
    case "pressing":
      if (event.type === "pointer-up") return result(SELECT_IDLE);
      if (
        event.type === "pointer-move" &&
        distance(event.point, state.start) > ctx.dragThresholdM &&
        state.ids.length > 0
      ) {
        const next = moving(state, event.point, ctx);
        return result(next, [], { kind: "move", ids: next.ids, dx: next.dx, dy: next.dy });
      }
      return result(state);
    case "moving": {
      const next = moving(state, event.point, ctx);
      if (event.type === "pointer-up")
        return result(SELECT_IDLE, next.dx === 0 && next.dy === 0 ? [] : [move(next.ids, next.dx, next.dy)]);
      return result(next, [], { kind: "move", ids: next.ids, dx: next.dx, dy: next.dy });
    }
    case "marquee": {
      const dragged = state.dragged || distance(event.point, state.start) > ctx.dragThresholdM;
      const box = boxOf(state.start, event.point);
      if (event.type === "pointer-up") {
        if (!dragged) return result(SELECT_IDLE, state.shift ? [] : [select([])]);
        return result(SELECT_IDLE, [select(fixturesInBox(ctx.scene, box), state.shift ? "add" : "replace")]);
      }
      const next = { ...state, current: event.point, dragged };
      return result(next, [], dragged ? { kind: "marquee", box } : null);
    }
  }
}
