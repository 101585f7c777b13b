import { describe, expect, it } from "vitest";
import { applyActions } from "../actions";
import { createScene } from "../scene";
import { openCase, rect, uuid, valve } from "../test-builders";
import { toolContext } from "./context";
import { SELECT_IDLE, selectTool } from "./select-tool";
import { down, drive, key, moveTo, plainContext, up } from "./test-drive";

const scene = () =>
  createScene({ width: 40, height: 20 }, [
    openCase(1, rect(2, 2, 2.4, 1)),
    openCase(2, rect(8, 2, 2.4, 1)),
    valve(3, 15, 10),
  ]);

describe("select tool", () => {
  it("selects on press and moves the selection by one action on release", () => {
    const ctx = plainContext(scene());
    const r = drive(selectTool, SELECT_IDLE, [down(3, 2.5), moveTo(4, 3), moveTo(5, 3.5)], ctx);
    expect(r.state.phase).toBe("moving");
    expect(r.last.preview).toEqual({ kind: "move", ids: [uuid(1)], dx: 2, dy: 1 });
    const done = drive(selectTool, r.state, [up(5, 3.5)], ctx);
    expect([...r.actions, ...done.actions]).toEqual([
      { type: "select", ids: [uuid(1)], mode: "replace" },
      { type: "move", ids: [uuid(1)], dx: 2, dy: 1 },
    ]);
  });

  it("drags the whole multi-selection from any selected fixture, with snapping", () => {
    let s = scene();
    s = { ...s, selection: [uuid(1), uuid(2)] };
    // Grid of 0.5 m: a drag of 1.2 m puts the selection's left edge (x = 2) at 3.0.
    const ctx = toolContext(
      s,
      { gridM: 0.5, snapToFixtures: true, toleranceM: 0.1, dragThresholdM: 0.05 },
      () => "unused",
    );
    const r = drive(selectTool, SELECT_IDLE, [down(9, 2.5), moveTo(10.2, 2.5), up(10.2, 2.5)], ctx);
    expect(r.actions).toEqual([{ type: "move", ids: [uuid(1), uuid(2)], dx: 1, dy: 0 }]);
  });

  it("toggles with Shift and clears on a click on empty plan", () => {
    const ctx = plainContext({ ...scene(), selection: [uuid(1)] });
    const shiftClick = drive(selectTool, SELECT_IDLE, [down(9, 2.5, true), up(9, 2.5)], ctx);
    expect(applyActions(ctx.scene, shiftClick.actions).selection).toEqual([uuid(1), uuid(2)]);
    const empty = drive(selectTool, SELECT_IDLE, [down(30, 15), up(30, 15)], ctx);
    expect(applyActions(ctx.scene, empty.actions).selection).toEqual([]);
  });

  it("marquee-selects fixtures wholly inside the box", () => {
    const ctx = plainContext(scene());
    const r = drive(selectTool, SELECT_IDLE, [down(1, 1), moveTo(11, 4), up(11, 4)], ctx);
    expect(applyActions(ctx.scene, r.actions).selection).toEqual([uuid(1), uuid(2)]);
  });

  it("cancels a drag on Escape and deletes the selection on Delete", () => {
    const ctx = plainContext({ ...scene(), selection: [uuid(3)] });
    const r = drive(selectTool, SELECT_IDLE, [down(15, 10), moveTo(16, 11), key("Escape"), up(16, 11)], ctx);
    expect(r.actions).toEqual([]);
    expect(selectTool(SELECT_IDLE, key("Delete"), ctx).actions).toEqual([{ type: "delete", ids: [uuid(3)] }]);
  });
});
