/**
 * Undo/redo as a stack of scenes. Scenes share unchanged fixtures structurally, so a step
 * costs one new fixtures map, not a copy of the plan.
 *
 * A gesture key coalesces a run of actions into one step: every action recorded with the
 * same key as the step before it (e.g. "nudge" for repeated arrow keys, or one drag's id)
 * replaces that step's result instead of adding a step. endGesture() closes the run.
 * Selection changes update the present without becoming steps.
 */
import { applyAction, isSelectionOnly, type SceneAction } from "./actions";
import type { Scene } from "./scene";

export const DEFAULT_MAX_DEPTH = 200;

export interface History {
  readonly past: readonly Scene[];
  readonly present: Scene;
  readonly future: readonly Scene[];
  /** The gesture key of the newest step, while that gesture is still open. */
  readonly gesture: string | null;
  readonly maxDepth: number;
}

export function createHistory(scene: Scene, maxDepth = DEFAULT_MAX_DEPTH): History {
  if (!(Number.isInteger(maxDepth) && maxDepth >= 1))
    throw new RangeError("maxDepth must be a whole number of at least 1");
  return { past: [], present: scene, future: [], gesture: null, maxDepth };
}

/** Applies an action to the present and records it as an undoable step (see the gesture rule above). */
export function record(history: History, action: SceneAction, gesture: string | null = null): History {
  return recordAll(history, [action], gesture);
}

/** Applies several actions as ONE step (e.g. a tool's commit, or a paste that adds and selects). */
export function recordAll(history: History, actions: readonly SceneAction[], gesture: string | null = null): History {
  let next = history.present;
  let edits = false;
  for (const a of actions) {
    const after = applyAction(next, a);
    if (after !== next && !isSelectionOnly(a)) edits = true;
    next = after;
  }
  if (next === history.present) return history;
  if (!edits) return { ...history, present: next };
  if (gesture !== null && gesture === history.gesture && history.past.length > 0) {
    return { ...history, present: next, future: [] };
  }
  const past = [...history.past, history.present];
  if (past.length > history.maxDepth) past.splice(0, past.length - history.maxDepth);
  return { ...history, past, present: next, future: [], gesture };
}

export function endGesture(history: History): History {
  return history.gesture === null ? history : { ...history, gesture: null };
}

export function canUndo(history: History): boolean {
  return history.past.length > 0;
}

export function canRedo(history: History): boolean {
  return history.future.length > 0;
}

export function undo(history: History): History {
  if (history.past.length === 0) return history;
  const present = history.past[history.past.length - 1];
  return {
    ...history,
    past: history.past.slice(0, -1),
    present,
    future: [history.present, ...history.future],
    gesture: null,
  };
}

export function redo(history: History): History {
  if (history.future.length === 0) return history;
  const [present, ...future] = history.future;
  return { ...history, past: [...history.past, history.present], present, future, gesture: null };
}

/** Starts over from a scene (after loading or reloading a plan): nothing to undo into. */
export function resetHistory(history: History, scene: Scene): History {
  return createHistory(scene, history.maxDepth);
}
