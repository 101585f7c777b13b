/**
 * Polygon tool: each click adds a vertex; the outline closes on a click at the first vertex,
 * a double-click (double-tap) or Enter (with at least 3 vertices and no crossing edges). Backspace removes
 * the last vertex; Escape cancels.
 */
import { isSelfIntersecting } from "#core/analysis/geometry/segments";
import type { FixtureKind } from "#core/contracts/fixture-kinds";
import { add } from "../actions";
import type { PlanPoint } from "../../../../lib/plan-view/coordinates";
import { newFixture } from "../new-fixture";
import { distance, result, type ToolContext, type ToolEvent, type ToolResult } from "./tool";

export type PolygonToolState =
  | { phase: "idle" }
  | { phase: "placing"; vertices: readonly PlanPoint[]; hover: PlanPoint | null };

export const POLYGON_IDLE: PolygonToolState = { phase: "idle" };

type R = ToolResult<PolygonToolState>;

function placing(vertices: readonly PlanPoint[], hover: PlanPoint | null, message: string | null = null): R {
  return result(
    { phase: "placing", vertices, hover },
    [],
    { kind: "outline", vertices, closed: false, hover },
    message,
  );
}

function close(kind: FixtureKind, vertices: readonly PlanPoint[], hover: PlanPoint | null, ctx: ToolContext): R {
  if (vertices.length < 3) return placing(vertices, hover, "An outline needs at least 3 corners.");
  const polygon = vertices.map((v): [number, number] => [v.x, v.y]);
  if (isSelfIntersecting(polygon))
    return placing(vertices, hover, "The outline's edges cross; move or remove the last corner (Backspace).");
  return result(POLYGON_IDLE, [add([newFixture(kind, ctx.newId(), { polygon })])]);
}

export function polygonTool(kind: FixtureKind, state: PolygonToolState, event: ToolEvent, ctx: ToolContext): R {
  if (state.phase === "idle") {
    return event.type === "pointer-down" ? placing([ctx.snap(event.point)], null) : result(state);
  }
  const { vertices, hover } = state;
  switch (event.type) {
    case "key":
      if (event.key === "Escape") return result(POLYGON_IDLE);
      if (event.key === "Enter") return close(kind, vertices, hover, ctx);
      if (event.key === "Backspace")
        return vertices.length > 1 ? placing(vertices.slice(0, -1), hover) : result(POLYGON_IDLE);
      return placing(vertices, hover);
    case "double-click":
      // The browser sends two presses first; the second landed on the last vertex and was ignored.
      return close(kind, vertices, hover, ctx);
    case "pointer-move":
      return placing(vertices, ctx.snap(event.point));
    case "pointer-up":
      return placing(vertices, hover);
    case "cancel":
      // Corners are placed one tap at a time: a lost pointer takes none of them back.
      return placing(vertices, hover);
    case "pointer-down": {
      const p = ctx.snap(event.point);
      if (vertices.length >= 3 && distance(p, vertices[0]) <= ctx.pickToleranceM)
        return close(kind, vertices, hover, ctx);
      // A press on (or within a drag's wobble of) the last corner adds nothing: the second tap
      // of a double-tap on a tablet lands a few pixels off the first.
      if (distance(p, vertices[vertices.length - 1]) <= Math.max(1e-9, ctx.dragThresholdM)) return placing(vertices, p);
      return placing([...vertices, p], p);
    }
  }
}
