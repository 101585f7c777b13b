import { describe, expect, it } from "vitest";
import { editedReading, walkStep, type WalkEvent, type WalkMode } from "./walk-mode";

type R = { id: string; x: number };
const r1: R = { id: "r1", x: 1 };
const walking: WalkMode<R> = { kind: "walking" };
const tap: WalkEvent<R> = { type: "tap", x: 4, y: 2, fixtureId: "case-3" };

/** Runs events from a mode, collecting the effects, as the screen would. */
function drive(from: WalkMode<R>, events: WalkEvent<R>[], readOnly = false) {
  let mode = from;
  const effects: string[] = [];
  for (const e of events) {
    const step = walkStep(mode, e, readOnly);
    mode = step.mode;
    effects.push(step.effect.kind === "move-reading" ? `move ${step.effect.readingId}` : step.effect.kind);
  }
  return { mode, effects };
}

describe("the Walk screen's mode", () => {
  it("takes a reading on each tap while walking", () => {
    expect(drive(walking, [tap, tap])).toEqual({ mode: walking, effects: ["take-reading", "take-reading"] });
  });

  it("closes the edit keypad and takes a new reading on a tap", () => {
    const { mode, effects } = drive(walking, [{ type: "edit", reading: r1 }, tap]);
    expect(effects).toEqual(["none", "take-reading"]);
    expect(mode).toEqual(walking);
  });

  it("moves a reading from its edit keypad, keeps the keypad open meanwhile and shows the moved reading after", () => {
    const moving = drive(walking, [
      { type: "edit", reading: r1 },
      { type: "move", readingId: "r1" },
    ]).mode;
    expect(moving).toEqual({ kind: "moving", readingId: "r1", editing: r1 });
    expect(editedReading(moving)).toBe(r1);
    const { mode, effects } = drive(moving, [tap, { type: "moved", reading: { id: "r1", x: 4 } }]);
    expect(effects).toEqual(["move r1", "none"]);
    expect(mode).toEqual({ kind: "editing", reading: { id: "r1", x: 4 } });
  });

  it("moves a reading picked from the list without opening a keypad; cancel returns to walking", () => {
    expect(drive(walking, [{ type: "move", readingId: "r7" }, tap])).toEqual({
      mode: walking,
      effects: ["none", "move r7"],
    });
    expect(drive(walking, [{ type: "move", readingId: "r7" }, { type: "cancel" }]).mode).toEqual(walking);
  });

  it("places a leak on the next tap and opens its form there, with the fixture under it; taps wait for the form", () => {
    const { mode, effects } = drive(walking, [{ type: "toggle-leak" }, tap, tap, { type: "toggle-leak" }]);
    expect(effects).toEqual(["none", "none", "none", "none"]);
    expect(mode).toEqual({ kind: "describing-leak", spot: { x: 4, y: 2, fixtureId: "case-3" } });
    expect(drive(mode, [{ type: "done" }]).mode).toEqual(walking);
  });

  it("one mode at a time: marking a leak replaces a pending move, and the leak button toggles back", () => {
    expect(drive(walking, [{ type: "move", readingId: "r1" }, { type: "toggle-leak" }]).mode).toEqual({
      kind: "placing-leak",
    });
    expect(drive(walking, [{ type: "toggle-leak" }, { type: "toggle-leak" }]).mode).toEqual(walking);
  });

  it("does nothing on a tap when the sweep is reviewed (read only)", () => {
    const moving: WalkMode<R> = { kind: "moving", readingId: "r1", editing: null };
    expect(drive(moving, [tap], true)).toEqual({ mode: moving, effects: ["none"] });
    expect(drive(walking, [tap], true).effects).toEqual(["none"]);
  });
});
