import { useEffect, useRef, type RefObject } from "react";
import { move, select } from "../model/actions";
import type { Scene } from "../model/scene";
import { commandFor } from "../model/shortcuts";
import type { EditorHistory } from "./use-editor-history";

interface Options {
  enabled: boolean;
  canEdit: boolean;
  scene: Scene;
  gridM: number | null;
  editor: EditorHistory;
  /** The drawing tool gets Escape, Enter and Backspace first while it is mid-gesture. */
  toolKeys: RefObject<((key: string) => boolean) | null>;
  onDuplicate: () => void;
  onDelete: () => void;
  onTool: (tool: "select" | "pan" | "rectangle" | "polygon") => void;
  onZoom: (direction: "in" | "out" | "fit") => void;
  onPanning: (on: boolean) => void;
  onEscape: () => void;
}

/** Nudges step by the snap grid, or 10 cm without one (Shift: ten steps). */
const DEFAULT_NUDGE_M = 0.1;

function typing(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  if (!el || !el.tagName) return false;
  return el.isContentEditable || ["INPUT", "TEXTAREA", "SELECT"].includes(el.tagName);
}

/** The editor's keyboard: shortcuts.ts names the command, this runs it (never while typing in a field). */
export function useEditorShortcuts(o: Options) {
  const opts = useRef(o);
  opts.current = o;
  useEffect(() => {
    if (!o.enabled) return;
    const down = (e: KeyboardEvent) => {
      const { canEdit, scene, editor, gridM } = opts.current;
      if (typing(e.target)) return;
      if (e.key === " ") {
        e.preventDefault();
        opts.current.onPanning(true);
        return;
      }
      if ((e.key === "Escape" || e.key === "Enter" || e.key === "Backspace") && opts.current.toolKeys.current?.(e.key)) {
        e.preventDefault();
        return;
      }
      const c = commandFor({ key: e.key, ctrl: e.ctrlKey, meta: e.metaKey, shift: e.shiftKey, alt: e.altKey });
      if (!c) return;
      const editing = ["undo", "redo", "delete", "duplicate", "nudge"].includes(c.type);
      if (editing && !canEdit) return;
      e.preventDefault();
      switch (c.type) {
        case "undo":
          return editor.undo();
        case "redo":
          return editor.redo();
        case "delete":
          return opts.current.onDelete();
        case "duplicate":
          return opts.current.onDuplicate();
        case "select-all":
          return editor.apply([select(scene.order)]);
        case "escape":
          return opts.current.onEscape();
        case "nudge": {
          if (scene.selection.length === 0) return;
          const step = (gridM ?? DEFAULT_NUDGE_M) * (c.large ? 10 : 1);
          // Repeated arrow presses coalesce into one undo step (history.ts gestures).
          return editor.apply([move(scene.selection, c.dx * step, c.dy * step)], "nudge");
        }
        case "tool":
          return opts.current.onTool(c.tool);
        case "zoom":
          return opts.current.onZoom(c.direction);
      }
    };
    const up = (e: KeyboardEvent) => {
      if (e.key === " ") opts.current.onPanning(false);
      if (e.key.startsWith("Arrow")) opts.current.editor.endGesture();
    };
    window.addEventListener("keydown", down);
    window.addEventListener("keyup", up);
    return () => {
      window.removeEventListener("keydown", down);
      window.removeEventListener("keyup", up);
    };
  }, [o.enabled]);
}
