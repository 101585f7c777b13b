/**
 * What every drawing tool shares. A tool is a small state machine: a pure reducer of pointer
 * and key events given in plan metres (the view converts from stage pixels first) that
 * returns its next state, the scene actions to record, and a preview for the view to draw.
 */
import type { Bounds } from "#core/analysis/geometry/types";
import type { SceneAction } from "../actions";
import type { PlanPoint } from "../../../../lib/plan-view/coordinates";
import type { Scene } from "../scene";

export type ToolEvent =
  | { type: "pointer-down"; point: PlanPoint; shift?: boolean }
  | { type: "pointer-move"; point: PlanPoint; shift?: boolean }
  | { type: "pointer-up"; point: PlanPoint; shift?: boolean }
  | { type: "double-click"; point: PlanPoint }
  | { type: "key"; key: string }
  /**
   * The pointer was lost before it was let go (the browser cancelled it): the gesture under way
   * ends and records nothing, and its preview goes.
   */
  | { type: "cancel" };

/** What the view draws while a gesture is under way; nothing is in the scene yet. */
export type ToolPreview =
  | { kind: "outline"; vertices: readonly PlanPoint[]; closed: boolean; hover: PlanPoint | null }
  | { kind: "move"; ids: readonly string[]; dx: number; dy: number }
  | { kind: "marquee"; box: Bounds };

export interface ToolResult<S> {
  state: S;
  actions: SceneAction[];
  preview: ToolPreview | null;
  /** A plain-words reason the gesture cannot finish yet (e.g. crossing edges). */
  message: string | null;
}

export interface ToolContext {
  scene: Scene;
  /** Makes the id of a new fixture (crypto.randomUUID in the editor, a counter in tests). */
  newId: () => string;
  /** Snaps a drawn point (snapping.snapPoint) to fixtures other than `exclude`; identity when off. */
  snap: (p: PlanPoint, exclude?: readonly string[]) => PlanPoint;
  /** Snaps a drag of the selection (snapping.snapMove); identity when off. */
  snapMove: (ids: readonly string[], dx: number, dy: number) => { dx: number; dy: number };
  /** A press turns into a drag past this distance (a few screen px in metres). */
  dragThresholdM: number;
  /** How near a click must be to a thin fixture or a point to pick it, and to the first vertex to close a polygon. */
  pickToleranceM: number;
}

export function result<S>(
  state: S,
  actions: SceneAction[] = [],
  preview: ToolPreview | null = null,
  message: string | null = null,
): ToolResult<S> {
  return { state, actions, preview, message };
}

export function distance(a: PlanPoint, b: PlanPoint): number {
  return Math.hypot(a.x - b.x, a.y - b.y);
}

export function boxOf(a: PlanPoint, b: PlanPoint): Bounds {
  return { minX: Math.min(a.x, b.x), minY: Math.min(a.y, b.y), maxX: Math.max(a.x, b.x), maxY: Math.max(a.y, b.y) };
}
