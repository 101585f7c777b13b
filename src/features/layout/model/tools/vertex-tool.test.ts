import { describe, expect, it } from "vitest";
import type { PolygonFixture, RoomFixture } from "#core/contracts/fixtures";
import { applyActions } from "../actions";
import { createScene, type Scene } from "../scene";
import { room, uuid } from "../test-builders";
import { toolContext } from "./context";
import { dbl, down, drive, key, moveTo, plainContext, up } from "./test-drive";
import { VERTEX_IDLE, vertexTool } from "./vertex-tool";

// A 4 m × 3 m walk-in with a 1 m door centred on its bottom edge (edge 2, from (4,3) to (0,3)).
function scene(): Scene {
  const s = createScene({ width: 20, height: 10 }, [
    room(
      1,
      [
        [0, 0],
        [4, 0],
        [4, 3],
        [0, 3],
      ],
      { edge: 2, offset: 1.5, width: 1 },
    ),
  ]);
  return { ...s, selection: [uuid(1)] };
}
const outline = (s: Scene) => (s.fixtures[uuid(1)] as PolygonFixture).polygon;

describe("vertex tool", () => {
  it("drags a corner and keeps the door at its place along the edge", () => {
    const ctx = plainContext(scene());
    const r = drive(vertexTool, VERTEX_IDLE, [down(4.05, 3.05), moveTo(5, 4), up(6, 3)], ctx);
    const s = applyActions(ctx.scene, r.actions);
    expect(outline(s)).toEqual([
      [0, 0],
      [4, 0],
      [6, 3],
      [0, 3],
    ]);
    // The bottom edge is now 6 m; the door's centre stays half-way: 3 m along, offset 2.5 m.
    expect((s.fixtures[uuid(1)] as RoomFixture).door).toEqual({ edge: 2, offset: 2.5, width: 1 });
  });

  it("adds a corner on a double-clicked edge and moves the door index past it", () => {
    const ctx = plainContext(scene());
    const r = drive(vertexTool, VERTEX_IDLE, [dbl(2, 0.05)], ctx);
    const s = applyActions(ctx.scene, r.actions);
    expect(outline(s)).toEqual([
      [0, 0],
      [2, 0],
      [4, 0],
      [4, 3],
      [0, 3],
    ]);
    expect((s.fixtures[uuid(1)] as RoomFixture).door).toEqual({ edge: 3, offset: 1.5, width: 1 });
  });

  it("deletes the corner last touched, but never below 3", () => {
    let ctx = plainContext(scene());
    const added = applyActions(ctx.scene, drive(vertexTool, VERTEX_IDLE, [dbl(2, 0.05)], ctx).actions);
    ctx = plainContext(added);
    const r = drive(vertexTool, VERTEX_IDLE, [down(2, 0), up(2, 0), key("Delete")], ctx);
    const removed = applyActions(added, r.actions);
    expect(outline(removed)).toEqual([
      [0, 0],
      [4, 0],
      [4, 3],
      [0, 3],
    ]);
    expect((removed.fixtures[uuid(1)] as RoomFixture).door).toEqual({ edge: 2, offset: 1.5, width: 1 });
    const tri = createScene({ width: 20, height: 10 }, [
      room(
        2,
        [
          [0, 0],
          [4, 0],
          [0, 3],
        ],
        null,
      ),
    ]);
    const t = drive(
      vertexTool,
      VERTEX_IDLE,
      [down(0, 0), up(0, 0), key("Delete")],
      plainContext({ ...tri, selection: [uuid(2)] }),
    );
    expect(t.actions).toEqual([]);
    expect(t.last.message).toBe("An outline needs at least 3 corners.");
  });

  it("does not snap a dragged corner back onto its own outline", () => {
    const ctx = toolContext(
      scene(),
      { gridM: null, snapToFixtures: true, toleranceM: 0.2, dragThresholdM: 0.02 },
      () => "unused",
    );
    const r = drive(vertexTool, VERTEX_IDLE, [down(4, 3), moveTo(4.1, 3.1), up(4.1, 3.1)], ctx);
    expect(outline(applyActions(ctx.scene, r.actions))[2]).toEqual([4.1, 3.1]);
  });

  it("refuses a drag that would cross the edges, and cancels on Escape", () => {
    const ctx = plainContext(scene());
    const crossed = drive(vertexTool, VERTEX_IDLE, [down(4, 3), moveTo(2, -1), up(2, -1)], ctx);
    expect(crossed.actions).toEqual([]);
    expect(crossed.last.message).toMatch(/edges cross/);
    expect(drive(vertexTool, VERTEX_IDLE, [down(4, 3), moveTo(8, 8), key("Escape"), up(8, 8)], ctx).actions).toEqual(
      [],
    );
  });
});
