import { describe, expect, it } from "vitest";
import { drawTool, idleState, runTool } from "./active-tool";
import { down, moveTo, plainContext, up } from "./test-drive";
import { applyActions, select } from "../actions";
import { createScene } from "../scene";
import { openCase, rect, uuid } from "../test-builders";

describe("the active tool", () => {
  it("draws points for point kinds and outlines otherwise", () => {
    expect(drawTool("valve", "rectangle")).toEqual({ tool: "point", kind: "valve" });
    expect(drawTool("gondola", "polygon")).toEqual({ tool: "polygon", kind: "gondola" });
  });
  it("feeds events to the tool in hand; the pan tool never edits", () => {
    const ctx = plainContext();
    const rect = { tool: "rectangle", kind: "checkout" } as const;
    let s = idleState(rect);
    for (const e of [down(1, 1), moveTo(3, 2)]) s = runTool(rect, s, e, ctx).state;
    const r = runTool(rect, s, up(3, 2), ctx);
    expect(r.actions).toHaveLength(1);
    expect(r.actions[0]).toMatchObject({
      type: "add",
      fixtures: [
        {
          kind: "checkout",
          polygon: [
            [1, 1],
            [3, 1],
            [3, 2],
            [1, 2],
          ],
        },
      ],
    });
    expect(runTool({ tool: "pan" }, idleState({ tool: "pan" }), down(1, 1), ctx).actions).toEqual([]);
  });
  it("hands corner drags to the vertex tool", () => {
    const scene = applyActions(createScene({ width: 40, height: 20 }, [openCase(1, rect(2, 2, 4, 1))]), [
      select([uuid(1)]),
    ]);
    const ctx = plainContext(scene);
    const tool = { tool: "vertex" } as const;
    let s = idleState(tool);
    for (const e of [down(6, 3), moveTo(7, 3.5)]) s = runTool(tool, s, e, ctx).state;
    const r = runTool(tool, s, up(7, 3.5), ctx);
    expect(r.actions).toEqual([
      {
        type: "set-vertices",
        id: uuid(1),
        polygon: [
          [2, 2],
          [6, 2],
          [7, 3.5],
          [2, 3],
        ],
      },
    ]);
  });
});
