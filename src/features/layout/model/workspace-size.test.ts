// Sizes checked by hand from the rule in workspace-size.ts; the viewport sizes are those of a
// 1366 × 860 laptop window and an 820 × 1180 tablet (common practice, no published source).
import { describe, expect, it } from "vitest";
import { MIN_STAGE_HEIGHT_PX, workspaceStageSize } from "./workspace-size";

const wide = { contentWidth: 2000, contentHeight: 1200, marginPx: 16 }; // a 60 m × 36 m plan

describe("the editor's stage size", () => {
  it("fills the window under the tools when the drawing is taller than that room", () => {
    // 860 − 140 − 8 = 712 px of room; the drawing at 970 px wide would want 16 + 938 × 0.6 + 16 = 594.8 px.
    expect(workspaceStageSize({ boxWidth: 970, windowHeight: 860, aboveStage: 140, ...wide })).toEqual({
      width: 970,
      height: 594,
    });
    // A square drawing wants more than the room: the stage stops at the window's bottom.
    const square = { contentWidth: 1000, contentHeight: 1000, marginPx: 16 };
    expect(workspaceStageSize({ boxWidth: 970, windowHeight: 860, aboveStage: 140, ...square })).toEqual({
      width: 970,
      height: 712,
    });
  });

  it("is no taller than a wide drawing needs on a portrait tablet", () => {
    // 788 px wide: 16 + 756 × 0.6 + 16 = 485.6 px, far less than the 1180 − 200 − 8 px of room.
    expect(workspaceStageSize({ boxWidth: 788, windowHeight: 1180, aboveStage: 200, ...wide }).height).toBe(485);
  });

  it("keeps a usable minimum in a short window", () => {
    const s = workspaceStageSize({ boxWidth: 200, windowHeight: 400, aboveStage: 380, ...wide });
    expect(s).toEqual({ width: 320, height: MIN_STAGE_HEIGHT_PX });
  });

  it("refuses sizes that are not numbers, and an empty drawing", () => {
    expect(() => workspaceStageSize({ boxWidth: Number.NaN, windowHeight: 800, aboveStage: 0, ...wide })).toThrow(
      "boxWidth must be a finite number",
    );
    expect(() =>
      workspaceStageSize({
        boxWidth: 800,
        windowHeight: 800,
        aboveStage: 0,
        contentWidth: 0,
        contentHeight: 10,
        marginPx: 16,
      }),
    ).toThrow("width and height must be above 0");
  });
});
