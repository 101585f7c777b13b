/**
 * The tool in the lead tech's hand, and one entry point that feeds it an event. Drawing tools
 * carry the kind they draw; "pan" only moves the view and never touches the scene.
 */
import { isPointKind, type FixtureKind, type PointKind, type PolygonKind } from "#core/contracts/fixture-kinds";
import { pointTool, POINT_IDLE, type PointToolState } from "./point-tool";
import { polygonTool, POLYGON_IDLE, type PolygonToolState } from "./polygon-tool";
import { rectangleTool, RECTANGLE_IDLE, type RectangleToolState } from "./rectangle-tool";
import { selectTool, SELECT_IDLE, type SelectToolState } from "./select-tool";
import { vertexTool, VERTEX_IDLE, type VertexToolState } from "./vertex-tool";
import { result, type ToolContext, type ToolEvent, type ToolResult } from "./tool";

export type ActiveTool =
  | { tool: "select" }
  | { tool: "pan" }
  | { tool: "vertex" }
  | { tool: "rectangle"; kind: PolygonKind }
  | { tool: "polygon"; kind: PolygonKind }
  | { tool: "point"; kind: PointKind };

export type AnyToolState = SelectToolState | RectangleToolState | PolygonToolState | PointToolState | VertexToolState;

export function idleState(active: ActiveTool): AnyToolState {
  switch (active.tool) {
    case "select":
    case "pan":
      return SELECT_IDLE;
    case "vertex":
      return VERTEX_IDLE;
    case "rectangle":
      return RECTANGLE_IDLE;
    case "polygon":
      return POLYGON_IDLE;
    case "point":
      return POINT_IDLE;
  }
}

/** The drawing tool for a kind: points for point kinds, otherwise the outline tool asked for. */
export function drawTool(kind: FixtureKind, shape: "rectangle" | "polygon"): ActiveTool {
  if (isPointKind(kind)) return { tool: "point", kind };
  return { tool: shape, kind };
}

export function runTool(
  active: ActiveTool,
  state: AnyToolState,
  event: ToolEvent,
  ctx: ToolContext,
): ToolResult<AnyToolState> {
  switch (active.tool) {
    case "pan":
      return result(state);
    case "select":
      return selectTool(state as SelectToolState, event, ctx);
    case "vertex":
      return vertexTool(state as VertexToolState, event, ctx);
    case "rectangle":
      return rectangleTool(active.kind, state as RectangleToolState, event, ctx);
    case "polygon":
      return polygonTool(active.kind, state as PolygonToolState, event, ctx);
    case "point":
      return pointTool(active.kind, state as PointToolState, event, ctx);
  }
}
