import { describe, expect, it } from "vitest";
import { commandFor, type KeyPress } from "./shortcuts";

const press = (key: string, mods: Partial<KeyPress> = {}): KeyPress => ({ key, ctrl: false, meta: false, shift: false, alt: false, ...mods });

describe("editor shortcuts", () => {
  it("binds undo and both usual redo chords, with Ctrl or Cmd", () => {
    expect(commandFor(press("z", { ctrl: true }))).toEqual({ type: "undo" });
    expect(commandFor(press("z", { meta: true }))).toEqual({ type: "undo" });
    expect(commandFor(press("Z", { ctrl: true, shift: true }))).toEqual({ type: "redo" });
    expect(commandFor(press("y", { ctrl: true }))).toEqual({ type: "redo" });
  });
  it("binds delete, duplicate, escape and nudges", () => {
    expect(commandFor(press("Delete"))).toEqual({ type: "delete" });
    expect(commandFor(press("Backspace"))).toEqual({ type: "delete" });
    expect(commandFor(press("d", { ctrl: true }))).toEqual({ type: "duplicate" });
    expect(commandFor(press("Escape"))).toEqual({ type: "escape" });
    expect(commandFor(press("ArrowLeft", { shift: true }))).toEqual({ type: "nudge", dx: -1, dy: 0, large: true });
    expect(commandFor(press("ArrowDown"))).toEqual({ type: "nudge", dx: 0, dy: 1, large: false });
  });
  it("leaves the browser's own chords and plain typing alone", () => {
    expect(commandFor(press("c", { ctrl: true }))).toBeNull();
    expect(commandFor(press("x"))).toBeNull();
    expect(commandFor(press("r", { alt: true }))).toBeNull();
    expect(commandFor(press("r"))).toEqual({ type: "tool", tool: "rectangle" });
  });
});
