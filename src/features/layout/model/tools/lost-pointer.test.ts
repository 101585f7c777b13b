/**
 * A drag whose pointer is lost (the browser cancels it) leaves nothing drawn: the editor stage
 * feeds the tool a "cancel" event and draws whatever preview the tool then returns, so every
 * tool under way must come back without one, and without recording an edit.
 */
import { describe, expect, it } from "vitest";
import { createScene, type Scene } from "../scene";
import { openCase, rect, room, uuid } from "../test-builders";
import { runTool, idleState, type ActiveTool } from "./active-tool";
import { down, drive, moveTo, plainContext, up } from "./test-drive";
import type { ToolEvent } from "./tool";

const cancel: ToolEvent = { type: "cancel" };

function scene(): Scene {
  const s = createScene({ width: 40, height: 20 }, [
    openCase(1, rect(2, 2, 2.4, 1)),
    room(2, rect(20, 5, 4, 3), { edge: 2, offset: 1.5, width: 1 }),
  ]);
  return { ...s, selection: [uuid(2)] };
}

function run(active: ActiveTool, events: ToolEvent[]) {
  const ctx = plainContext(scene());
  return drive((s, e, c) => runTool(active, s, e, c), idleState(active), events, ctx);
}

describe("a lost pointer", () => {
  it("takes away a rectangle's outline half-way through its drag, adding nothing", () => {
    const active: ActiveTool = { tool: "rectangle", kind: "open-case" };
    const dragging = run(active, [down(10, 10), moveTo(14, 13)]);
    expect(dragging.last.preview).toMatchObject({ kind: "outline" });
    const r = run(active, [down(10, 10), moveTo(14, 13), cancel]);
    expect(r.last.preview).toBeNull();
    expect(r.state).toEqual({ phase: "idle" });
    expect(r.actions).toEqual([]);
    // The next press starts afresh, not from the lost drag's corner.
    const next = run(active, [down(10, 10), moveTo(14, 13), cancel, down(30, 15), up(30, 15)]);
    expect(next.actions).toEqual([]);
  });

  it("takes away a corner drag's outline and leaves the shape as it was", () => {
    const r = run({ tool: "vertex" }, [down(24, 8), moveTo(26, 9), cancel]);
    expect(r.last.preview).toBeNull();
    expect(r.state).toMatchObject({ phase: "idle", active: { id: uuid(2), index: 2 } });
    expect(r.actions).toEqual([]);
  });

  it("takes away the marquee, selecting nothing new", () => {
    const r = run({ tool: "select" }, [down(30, 15), moveTo(35, 18), cancel]);
    expect(r.last.preview).toBeNull();
    expect(r.state).toEqual({ phase: "idle" });
    expect(r.actions).toEqual([]);
  });

  it("ends a move of the selection without recording one", () => {
    const r = run({ tool: "select" }, [down(3, 2.5), moveTo(5, 3.5), cancel, up(5, 3.5)]);
    expect(r.last.preview).toBeNull();
    // Only the press's selection, no move.
    expect(r.actions).toEqual([{ type: "select", ids: [uuid(1)], mode: "replace" }]);
  });

  it("keeps the corners of an outline being placed tap by tap", () => {
    const active: ActiveTool = { tool: "polygon", kind: "machine-room" };
    const r = run(active, [down(10, 10), up(10, 10), down(14, 10), up(14, 10), cancel]);
    expect(r.state).toMatchObject({ phase: "placing" });
    expect(r.last.preview).toMatchObject({
      kind: "outline",
      vertices: [
        { x: 10, y: 10 },
        { x: 14, y: 10 },
      ],
    });
  });
});
