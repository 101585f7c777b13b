import { describe, expect, it } from "vitest";
import type { PolygonFixture } from "#core/contracts/fixtures";
import { applyActions } from "../actions";
import { planPoint } from "../../../../lib/plan-view/coordinates";
import { createScene, sceneFixtures } from "../scene";
import { idSource, uuid } from "../test-builders";
import { pointTool, POINT_IDLE } from "./point-tool";
import { POLYGON_IDLE, polygonTool } from "./polygon-tool";
import { RECTANGLE_IDLE, rectangleTool } from "./rectangle-tool";
import { toolContext } from "./context";
import { dbl, down, drive, key, moveTo, plainContext, up } from "./test-drive";

const rectangle = (
  s: Parameters<typeof rectangleTool>[1],
  e: Parameters<typeof rectangleTool>[2],
  c: Parameters<typeof rectangleTool>[3],
) => rectangleTool("door-case", s, e, c);
const polygon = (
  s: Parameters<typeof polygonTool>[1],
  e: Parameters<typeof polygonTool>[2],
  c: Parameters<typeof polygonTool>[3],
) => polygonTool("machine-room", s, e, c);

describe("rectangle tool", () => {
  it("goes idle → pointing → dragging → commit and adds one fixture", () => {
    const ctx = plainContext();
    let r = rectangle(RECTANGLE_IDLE, down(6, 3), ctx);
    expect(r.state.phase).toBe("pointing");
    r = rectangle(r.state, moveTo(6.02, 3.01), ctx);
    expect(r.state.phase).toBe("pointing"); // inside the drag threshold
    r = rectangle(r.state, moveTo(4, 4), ctx);
    expect(r.state.phase).toBe("dragging");
    expect(r.preview).toMatchObject({ kind: "outline", closed: true });
    const { actions, state } = drive(rectangle, r.state, [moveTo(2.2, 4), up(2.2, 4)], ctx);
    expect(state.phase).toBe("idle");
    expect(actions).toHaveLength(1);
    const [f] = sceneFixtures(applyActions(ctx.scene, actions)) as PolygonFixture[];
    // 3.8 m long at about 0.76 m a door (common practice, no published source): 5 doors.
    expect(f).toMatchObject({ id: uuid(1000), kind: "door-case", doorCount: 5, hasFans: true });
    // Dragged from the bottom-right: stored top-left first, clockwise on the y-down plan.
    expect(f.polygon).toEqual([
      [2.2, 3],
      [6, 3],
      [6, 4],
      [2.2, 4],
    ]);
  });
  it("adds nothing for a click, a flat drag or Escape", () => {
    const ctx = plainContext();
    expect(drive(rectangle, RECTANGLE_IDLE, [down(1, 1), up(1, 1)], ctx).actions).toEqual([]);
    const flat = drive(rectangle, RECTANGLE_IDLE, [down(1, 1), moveTo(3, 1), up(3, 1)], ctx);
    expect(flat.actions).toEqual([]);
    expect(flat.last.message).toMatch(/no width or no depth/);
    expect(drive(rectangle, RECTANGLE_IDLE, [down(1, 1), moveTo(3, 3), key("Escape"), up(3, 3)], ctx).actions).toEqual(
      [],
    );
  });
  it("snaps the corners through the context", () => {
    const ctx = {
      ...plainContext(),
      snap: (p: { x: number; y: number }) => planPoint(Math.round(p.x), Math.round(p.y)),
    };
    const { actions } = drive(rectangle, RECTANGLE_IDLE, [down(0.9, 1.2), moveTo(3.2, 2.8), up(3.2, 2.8)], ctx);
    expect((sceneFixtures(applyActions(ctx.scene, actions))[0] as PolygonFixture).polygon).toEqual([
      [1, 1],
      [3, 1],
      [3, 3],
      [1, 3],
    ]);
  });
});

describe("polygon tool", () => {
  const lShape = [down(0, 0), up(0, 0), down(4, 0), up(4, 0), down(4, 1), down(1, 1), down(1, 4), down(0, 4)];

  it("closes on a click at the first vertex", () => {
    const ctx = plainContext();
    const { actions, state } = drive(polygon, POLYGON_IDLE, [...lShape, down(0.1, 0.05)], ctx);
    expect(state).toEqual(POLYGON_IDLE);
    const [f] = sceneFixtures(applyActions(ctx.scene, actions)) as PolygonFixture[];
    expect(f.polygon).toEqual([
      [0, 0],
      [4, 0],
      [4, 1],
      [1, 1],
      [1, 4],
      [0, 4],
    ]);
    expect(f).toMatchObject({ kind: "machine-room", door: null, hasFans: false });
  });
  it("closes on a double-click (ignoring the repeated press) and on Enter", () => {
    const ctx = plainContext();
    const byDbl = drive(
      polygon,
      POLYGON_IDLE,
      [down(0, 0), down(3, 0), down(3, 2), up(3, 2), down(3, 2), up(3, 2), dbl(3, 2)],
      ctx,
    );
    expect(byDbl.actions).toHaveLength(1);
    expect((byDbl.actions[0] as unknown as { fixtures: PolygonFixture[] }).fixtures[0].polygon).toEqual([
      [0, 0],
      [3, 0],
      [3, 2],
    ]);
    expect(drive(polygon, POLYGON_IDLE, [down(0, 0), down(3, 0), down(3, 2), key("Enter")], ctx).actions).toHaveLength(
      1,
    );
  });
  it("on a tablet, a double-tap whose second tap lands a few pixels off adds no corner, and a finger's press near the first corner closes", () => {
    // A finger's double-tap: the second tap 3 cm (a few screen px) from the first, then the dbltap.
    const ctx = { ...plainContext(), dragThresholdM: 0.05 };
    const byTap = drive(
      polygon,
      POLYGON_IDLE,
      [down(0, 0), down(3, 0), down(3, 2), up(3, 2), down(3.03, 2.01), up(3.03, 2.01), dbl(3.03, 2.01)],
      ctx,
    );
    expect((byTap.actions[0] as unknown as { fixtures: PolygonFixture[] }).fixtures[0].polygon).toEqual([
      [0, 0],
      [3, 0],
      [3, 2],
    ]);
    // A press 0.35 m from the first corner: outside a mouse's pick tolerance, inside a finger's.
    const near = [down(0, 0), down(3, 0), down(3, 2), down(0.3, 0.18)];
    const mouse = toolContext(
      createScene({ width: 40, height: 20 }),
      { gridM: null, snapToFixtures: false, toleranceM: 0.1, dragThresholdM: 0.05 },
      idSource(),
    );
    expect(drive(polygon, POLYGON_IDLE, near, mouse).actions).toEqual([]);
    const finger = toolContext(
      createScene({ width: 40, height: 20 }),
      { gridM: null, snapToFixtures: false, toleranceM: 0.1, dragThresholdM: 0.05, pickToleranceM: 0.4 },
      idSource(),
    );
    const closed = drive(polygon, POLYGON_IDLE, near, finger);
    expect(closed.actions).toHaveLength(1);
    expect(closed.state).toEqual(POLYGON_IDLE);
  });
  it("refuses to close too few or crossing vertices, with a reason, and keeps drawing", () => {
    const ctx = plainContext();
    const few = drive(polygon, POLYGON_IDLE, [down(0, 0), down(3, 0), key("Enter")], ctx);
    expect(few.actions).toEqual([]);
    expect(few.state.phase).toBe("placing");
    expect(few.last.message).toBe("An outline needs at least 3 corners.");
    const bowTie = drive(polygon, POLYGON_IDLE, [down(0, 0), down(2, 0), down(0, 2), down(2, 2), key("Enter")], ctx);
    expect(bowTie.actions).toEqual([]);
    expect(bowTie.last.message).toMatch(/edges cross/);
    const fixed = drive(polygon, bowTie.state, [key("Backspace"), key("Enter")], ctx);
    expect(fixed.actions).toHaveLength(1);
  });
  it("cancels on Escape", () => {
    const r = drive(
      polygon,
      POLYGON_IDLE,
      [down(0, 0), down(3, 0), down(3, 2), key("Escape"), key("Enter")],
      plainContext(),
    );
    expect(r.state).toEqual(POLYGON_IDLE);
    expect(r.actions).toEqual([]);
  });
});

describe("point tool", () => {
  it("places a point per press, and none off the plan", () => {
    const ctx = plainContext(createScene({ width: 10, height: 10 }));
    const tool = (s: typeof POINT_IDLE, e: Parameters<typeof pointTool>[2], c: Parameters<typeof pointTool>[3]) =>
      pointTool("line-set-drop", s, e, c);
    const r = drive(tool, POINT_IDLE, [down(2, 3), up(2, 3), down(11, 3)], ctx);
    expect(r.actions).toHaveLength(1);
    expect((r.actions[0] as unknown as { fixtures: unknown[] }).fixtures[0]).toMatchObject({
      kind: "line-set-drop",
      point: { x: 2, y: 3 },
    });
    expect(r.last.message).toMatch(/outside/);
  });
});
