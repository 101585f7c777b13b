/**
 * Vertex tool, for reshaping the one selected outline: drag a corner to move it; double-click
 * an edge to add a corner there; Delete or Backspace removes the corner last touched (an
 * outline keeps at least 3). An edit whose edges would cross is refused with a reason.
 * Escape cancels a drag. Each finished edit is one set-vertices action.
 */
import { isSelfIntersecting } from "#core/analysis/geometry/segments";
import type { PolygonFixture, Vertex } from "#core/contracts/fixtures";
import { setVertices } from "../actions";
import { planPoint, type PlanPoint } from "../../../../lib/plan-view/coordinates";
import { distance, result, type ToolContext, type ToolEvent, type ToolResult } from "./tool";

export type VertexToolState =
  | { phase: "idle"; active: { id: string; index: number } | null }
  | { phase: "dragging"; id: string; index: number; start: PlanPoint; moved: boolean };

export const VERTEX_IDLE: VertexToolState = { phase: "idle", active: null };

type R = ToolResult<VertexToolState>;

function target(ctx: ToolContext): PolygonFixture | null {
  const { selection, fixtures } = ctx.scene;
  const f = selection.length === 1 ? fixtures[selection[0]] : undefined;
  return f && "polygon" in f ? f : null;
}

function outline(polygon: readonly Vertex[]) {
  return { kind: "outline" as const, vertices: polygon.map(([x, y]) => planPoint(x, y)), closed: true, hover: null };
}

function commit(f: PolygonFixture, polygon: Vertex[], active: { id: string; index: number } | null): R {
  if (isSelfIntersecting(polygon))
    return result(
      { phase: "idle", active },
      [],
      null,
      "That would make the outline's edges cross; the corner was put back.",
    );
  return result({ phase: "idle", active }, [setVertices(f.id, polygon)]);
}

function nearestEdgePoint(polygon: readonly Vertex[], p: PlanPoint): { edge: number; point: Vertex; d: number } {
  let best = { edge: -1, point: [0, 0] as Vertex, d: Infinity };
  for (let i = 0; i < polygon.length; i++) {
    const a = polygon[i];
    const b = polygon[(i + 1) % polygon.length];
    const dx = b[0] - a[0];
    const dy = b[1] - a[1];
    const len2 = dx * dx + dy * dy;
    const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a[0]) * dx + (p.y - a[1]) * dy) / len2));
    const q: Vertex = [a[0] + t * dx, a[1] + t * dy];
    const d = Math.hypot(q[0] - p.x, q[1] - p.y);
    if (d < best.d) best = { edge: i, point: q, d };
  }
  return best;
}

export function vertexTool(state: VertexToolState, event: ToolEvent, ctx: ToolContext): R {
  const f = target(ctx);
  if (!f) return result(VERTEX_IDLE);
  if (state.phase === "dragging") {
    if (event.type === "key")
      return event.key === "Escape"
        ? result({ phase: "idle", active: { id: state.id, index: state.index } })
        : result(state);
    if (event.type === "double-click") return result(state);
    if (event.type === "cancel") return result({ phase: "idle", active: { id: state.id, index: state.index } });
    // A press that never travels past the drag threshold only picks the corner (for Delete).
    const moved = state.moved || distance(event.point, state.start) > ctx.dragThresholdM;
    const active = { id: f.id, index: state.index };
    if (!moved)
      return event.type === "pointer-up" ? result({ phase: "idle", active }) : result(state, [], outline(f.polygon));
    const current = ctx.snap(event.point, [f.id]);
    const polygon = f.polygon.map((v, i): Vertex => (i === state.index ? [current.x, current.y] : [v[0], v[1]]));
    if (event.type === "pointer-up") return commit(f, polygon, active);
    return result({ ...state, moved }, [], outline(polygon));
  }
  switch (event.type) {
    case "pointer-down": {
      let index = -1;
      let bestD = ctx.pickToleranceM;
      f.polygon.forEach(([x, y], i) => {
        const d = Math.hypot(x - event.point.x, y - event.point.y);
        if (d <= bestD) [index, bestD] = [i, d];
      });
      if (index < 0) return result({ phase: "idle", active: null });
      return result({ phase: "dragging", id: f.id, index, start: event.point, moved: false }, [], outline(f.polygon));
    }
    case "double-click": {
      const hit = nearestEdgePoint(f.polygon, event.point);
      if (hit.d > ctx.pickToleranceM) return result(state);
      const polygon = f.polygon.map((v): Vertex => [v[0], v[1]]);
      polygon.splice(hit.edge + 1, 0, hit.point);
      return commit(f, polygon, { id: f.id, index: hit.edge + 1 });
    }
    case "key": {
      const { active } = state;
      if ((event.key !== "Delete" && event.key !== "Backspace") || !active || active.id !== f.id) return result(state);
      if (f.polygon.length <= 3) return result(state, [], null, "An outline needs at least 3 corners.");
      return commit(
        f,
        f.polygon.filter((_, i) => i !== active.index).map((v): Vertex => [v[0], v[1]]),
        null,
      );
    }
    default:
      return result(state);
  }
}
