import { useCallback, useMemo, useReducer } from "react";
import type { SceneAction } from "../model/actions";
import { createHistory, endGesture, recordAll, redo, resetHistory, undo, type History } from "../model/history";
import type { Scene } from "../model/scene";

type Command =
  | { type: "record"; actions: readonly SceneAction[]; gesture: string | null }
  | { type: "undo" }
  | { type: "redo" }
  | { type: "end-gesture" }
  | { type: "reset"; scene: Scene };

function reduce(history: History, command: Command): History {
  switch (command.type) {
    case "record":
      return recordAll(history, command.actions, command.gesture);
    case "undo":
      return undo(history);
    case "redo":
      return redo(history);
    case "end-gesture":
      return endGesture(history);
    case "reset":
      return resetHistory(history, command.scene);
  }
}

export interface EditorHistory {
  history: History;
  scene: Scene;
  /** Records actions as one undoable step (or coalesced into an open gesture of the same key). */
  apply: (actions: readonly SceneAction[], gesture?: string | null) => void;
  undo: () => void;
  redo: () => void;
  endGesture: () => void;
  reset: (scene: Scene) => void;
}

/** The editor's one source of truth: the model's history (history.ts) in a React reducer. */
export function useEditorHistory(initial: () => Scene): EditorHistory {
  const [history, dispatch] = useReducer(reduce, undefined, () => createHistory(initial()));
  const apply = useCallback((actions: readonly SceneAction[], gesture: string | null = null) => {
    if (actions.length > 0) dispatch({ type: "record", actions, gesture });
  }, []);
  const commands = useMemo(
    () => ({
      undo: () => dispatch({ type: "undo" }),
      redo: () => dispatch({ type: "redo" }),
      endGesture: () => dispatch({ type: "end-gesture" }),
      reset: (scene: Scene) => dispatch({ type: "reset", scene }),
    }),
    [],
  );
  return { history, scene: history.present, apply, ...commands };
}
