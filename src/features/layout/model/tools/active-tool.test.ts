import { describe, expect, it } from "vitest";
import { drawTool, idleState, runTool } from "./active-tool";
import { down, moveTo, plainContext, up } from "./test-drive";

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
    expect(r.actions[0]).toMatchObject({ type: "add", fixtures: [{ kind: "checkout", polygon: [[1, 1], [3, 1], [3, 2], [1, 2]] }] });
    expect(runTool({ tool: "pan" }, idleState({ tool: "pan" }), down(1, 1), ctx).actions).toEqual([]);
  });
});
