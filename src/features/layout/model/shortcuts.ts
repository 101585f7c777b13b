/**
 * Keyboard shortcuts of the layout editor as data: a pure map from a key press to a named
 * command, so the view wires one handler and the help panel lists the same table.
 * Ctrl on Windows and Linux is Cmd (meta) on macOS; both are accepted.
 */

export type EditorCommand =
  | { command: "undo" }
  | { command: "redo" }
  | { command: "duplicate" }
  | { command: "delete" }
  | { command: "select-all" }
  | { command: "clear-selection" }
  | { command: "nudge"; dx: number; dy: number }
  | { command: "rotate"; degrees: number };

export interface KeyPress {
  key: string;
  ctrl?: boolean;
  meta?: boolean;
  shift?: boolean;
  alt?: boolean;
}

/** Arrow keys move the selection by this much, ten times as far with Shift (metres). */
export const NUDGE_M = 0.05;
export const BIG_NUDGE_M = 0.5;

const ARROWS: Record<string, [number, number]> = {
  ArrowLeft: [-1, 0],
  ArrowRight: [1, 0],
  ArrowUp: [0, -1],
  ArrowDown: [0, 1],
};

/** The command for a key press, or null when the editor does not use it. */
export function commandForKey(k: KeyPress): EditorCommand | null {
  const mod = Boolean(k.ctrl || k.meta);
  const key = k.key.length === 1 ? k.key.toLowerCase() : k.key;
  if (mod && key === "z") return k.shift ? { command: "redo" } : { command: "undo" };
  if (mod && key === "y") return { command: "redo" };
  if (mod && key === "d") return { command: "duplicate" };
  if (mod && key === "a") return { command: "select-all" };
  if (mod || k.alt) return null;
  if (key === "Delete" || key === "Backspace") return { command: "delete" };
  if (key === "Escape") return { command: "clear-selection" };
  if (key === "r") return { command: "rotate", degrees: k.shift ? -90 : 90 };
  const arrow = ARROWS[key];
  if (arrow) {
    const step = k.shift ? BIG_NUDGE_M : NUDGE_M;
    return { command: "nudge", dx: arrow[0] * step, dy: arrow[1] * step };
  }
  return null;
}

/** The shortcut table for the help panel, in plain words. */
export const SHORTCUT_HELP: readonly { keys: string; does: string }[] = [
  { keys: "Ctrl/Cmd + Z", does: "Undo" },
  { keys: "Ctrl/Cmd + Shift + Z, Ctrl + Y", does: "Redo" },
  { keys: "Ctrl/Cmd + D", does: "Duplicate the selection" },
  { keys: "Ctrl/Cmd + A", does: "Select every fixture" },
  { keys: "Delete, Backspace", does: "Delete the selection" },
  { keys: "Escape", does: "Cancel the drawing, or clear the selection" },
  { keys: "Arrow keys", does: `Move the selection ${NUDGE_M * 100} cm (Shift: ${BIG_NUDGE_M * 100} cm)` },
  { keys: "R, Shift + R", does: "Turn the selection a quarter turn clockwise, anticlockwise" },
  { keys: "Enter", does: "Close the outline being drawn" },
];
