import { useEffect, useRef, type RefObject } from "react";
import { move, rotate, select } from "../model/actions";
import type { Scene } from "../model/scene";
import { commandForKey } from "../model/shortcuts";
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
  onTool: (tool: "select" | "pan" | "rectangle" | "polygon" | "vertex") => void;
  onZoom: (direction: "in" | "out" | "fit") => void;
  onPanning: (on: boolean) => void;
  onEscape: () => void;
}

/** Keys of the view and the tools, beside the model's editing shortcuts (shortcuts.ts). */
export const VIEW_KEYS: Readonly<
  Record<string, { tool?: "select" | "pan" | "rectangle" | "polygon" | "vertex"; zoom?: "in" | "out" | "fit" }>
> = {
  v: { tool: "select" },
  h: { tool: "pan" },
  b: { tool: "rectangle" },
  p: { tool: "polygon" },
  c: { tool: "vertex" },
  "+": { zoom: "in" },
  "=": { zoom: "in" },
  "-": { zoom: "out" },
  "0": { zoom: "fit" },
};

export const VIEW_KEY_HELP: readonly { keys: string; does: string }[] = [
  { keys: "V, H, B, P, C", does: "Select, pan, rectangle, outline and corner tools" },
  {
    keys: "Corner tool: drag, double-click, Delete",
    does: "Move a corner, add one on an edge, remove the last touched",
  },
  { keys: "Space + drag, middle button", does: "Pan the plan" },
  { keys: "Wheel, pinch, + − 0", does: "Zoom in, out, fit the plan" },
];

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
      if (["Escape", "Enter", "Backspace", "Delete"].includes(e.key) && opts.current.toolKeys.current?.(e.key)) {
        e.preventDefault();
        return;
      }
      const c = commandForKey({ key: e.key, ctrl: e.ctrlKey, meta: e.metaKey, shift: e.shiftKey, alt: e.altKey });
      if (!c) {
        const view = !e.ctrlKey && !e.metaKey && !e.altKey && !e.shiftKey ? VIEW_KEYS[e.key.toLowerCase()] : undefined;
        if (!view) return;
        e.preventDefault();
        if (view.tool) opts.current.onTool(view.tool);
        if (view.zoom) opts.current.onZoom(view.zoom);
        return;
      }
      if (c.command !== "select-all" && c.command !== "clear-selection" && !canEdit) return;
      e.preventDefault();
      switch (c.command) {
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
        case "clear-selection":
          return opts.current.onEscape();
        case "nudge": {
          if (scene.selection.length === 0) return;
          // With a snap grid, one press is one grid step (Shift: ten); repeated presses coalesce
          // into one undo step (history.ts gestures).
          const big = Math.abs(c.dx) + Math.abs(c.dy) > 0.1;
          const step = gridM === null ? 1 : (gridM * (big ? 10 : 1)) / (Math.abs(c.dx) + Math.abs(c.dy));
          return editor.apply([move(scene.selection, c.dx * step, c.dy * step)], "nudge");
        }
        case "rotate":
          if (scene.selection.length === 0) return;
          return editor.apply([rotate(scene.selection, (c.degrees * Math.PI) / 180, "each")]);
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
