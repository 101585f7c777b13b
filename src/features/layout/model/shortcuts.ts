/**
 * The editor's keyboard shortcuts as a pure map from a key press to a named command, so the
 * bindings are tested and listed in one place (the help text reads SHORTCUT_HELP).
 * Ctrl and Cmd are the same key here: Cmd on a Mac, Ctrl elsewhere.
 */
export type EditorCommand =
  | { type: "undo" }
  | { type: "redo" }
  | { type: "delete" }
  | { type: "duplicate" }
  | { type: "select-all" }
  | { type: "escape" }
  | { type: "nudge"; dx: -1 | 0 | 1; dy: -1 | 0 | 1; large: boolean }
  | { type: "tool"; tool: "select" | "pan" | "rectangle" | "polygon" }
  | { type: "zoom"; direction: "in" | "out" | "fit" };

export interface KeyPress {
  key: string;
  ctrl: boolean;
  meta: boolean;
  shift: boolean;
  alt: boolean;
}

const ARROWS: Record<string, [-1 | 0 | 1, -1 | 0 | 1]> = {
  ArrowLeft: [-1, 0],
  ArrowRight: [1, 0],
  ArrowUp: [0, -1],
  ArrowDown: [0, 1],
};

const TOOLS: Record<string, "select" | "pan" | "rectangle" | "polygon"> = { v: "select", h: "pan", r: "rectangle", p: "polygon" };

export function commandFor(k: KeyPress): EditorCommand | null {
  const mod = k.ctrl || k.meta;
  const key = k.key.length === 1 ? k.key.toLowerCase() : k.key;
  if (mod && !k.alt) {
    if (key === "z") return k.shift ? { type: "redo" } : { type: "undo" };
    if (key === "y") return { type: "redo" };
    if (key === "d") return { type: "duplicate" };
    if (key === "a") return { type: "select-all" };
    return null;
  }
  if (k.alt) return null;
  if (key === "Delete" || key === "Backspace") return { type: "delete" };
  if (key === "Escape") return { type: "escape" };
  if (key in ARROWS) {
    const [dx, dy] = ARROWS[key];
    return { type: "nudge", dx, dy, large: k.shift };
  }
  if (key in TOOLS && !k.shift) return { type: "tool", tool: TOOLS[key] };
  if (key === "+" || key === "=") return { type: "zoom", direction: "in" };
  if (key === "-") return { type: "zoom", direction: "out" };
  if (key === "0") return { type: "zoom", direction: "fit" };
  return null;
}

export const SHORTCUT_HELP: readonly [string, string][] = [
  ["Ctrl/⌘ Z", "Undo"],
  ["Shift Ctrl/⌘ Z or Ctrl Y", "Redo"],
  ["Delete", "Delete the selection"],
  ["Ctrl/⌘ D", "Duplicate the selection"],
  ["Arrows (Shift: ×10)", "Nudge the selection by one grid step"],
  ["Escape", "Stop drawing, then clear the selection"],
  ["V · H · R · P", "Select · pan · rectangle · outline tool"],
  ["Space + drag, or middle button", "Pan"],
  ["+ · − · 0", "Zoom in · out · fit"],
  ["Enter / double-click", "Close an outline"],
];
