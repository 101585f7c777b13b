import { describe, expect, it } from "vitest";
import {
  fitView,
  IMAGE_ZOOM,
  METRE_BASE,
  planPoint,
  planToStage,
  stagePoint,
  stageToPlan,
  type View,
} from "./coordinates";
import { applyPinch, pinchStep, type Fingers } from "./pinch";

const WIDE: { min: number; max: number } = { min: 0.01, max: 1000 };

describe("one pinch gesture", () => {
  it("measures spread ratio, midpoint and midpoint travel between two readings of the fingers", () => {
    const before: Fingers = [
      { x: 100, y: 100 },
      { x: 200, y: 100 },
    ];
    const after: Fingers = [
      { x: 80, y: 120 },
      { x: 240, y: 120 },
    ];
    // 160 px apart after 100 px: ×1.6; midpoint (150, 100) → (160, 120)
    expect(pinchStep(before, after)).toEqual({ factor: 1.6, centre: { x: 160, y: 120 }, dx: 10, dy: 20 });
  });

  it("keeps the plan point under the fingers under them while they spread and move", () => {
    const view: View = { zoom: 12, panX: -40, panY: 25 };
    const before: Fingers = [
      { x: 300, y: 200 },
      { x: 420, y: 260 },
    ];
    const after: Fingers = [
      { x: 270, y: 230 },
      { x: 470, y: 300 },
    ];
    const grabbed = stageToPlan(stagePoint(360, 230), METRE_BASE, view); // the old midpoint
    const next = applyPinch(view, pinchStep(before, after), WIDE);
    const now = planToStage(grabbed, METRE_BASE, next);
    expect(now.x).toBeCloseTo(370, 9); // the new midpoint
    expect(now.y).toBeCloseTo(265, 9);
    expect(next.zoom).toBeCloseTo(12 * (Math.hypot(200, 70) / Math.hypot(120, 60)), 9);
  });

  it("stops at the screen's zoom limit, and a zero spread zooms nothing", () => {
    const view: View = { zoom: 40, panX: 0, panY: 0 };
    const step = pinchStep(
      [
        { x: 0, y: 0 },
        { x: 10, y: 0 },
      ],
      [
        { x: 5, y: 5 },
        { x: 25, y: 5 },
      ],
    );
    const next = applyPinch(view, step, IMAGE_ZOOM);
    expect(next.zoom).toBe(IMAGE_ZOOM.max);
    expect(
      pinchStep(
        [
          { x: 5, y: 5 },
          { x: 5, y: 5 },
        ],
        [
          { x: 9, y: 5 },
          { x: 9, y: 5 },
        ],
      ).factor,
    ).toBe(1);
  });
});

describe("a view in metres", () => {
  it("fits a 60 m × 36 m store into a 916 × 556 canvas with an 8 px margin at 15 px/m", () => {
    const v = fitView(60, 36, 916, 556, 8);
    expect(v.zoom).toBe(15);
    expect(planToStage(planPoint(60, 36), METRE_BASE, v)).toEqual(stagePoint(908, 548));
  });
  it("clamps the fit to the screen's limits (a 1 m plan on a phone stops at the Walk's 400 px/m)", () => {
    expect(fitView(1, 1, 800, 800, 12, { min: 2, max: 400 }).zoom).toBe(400);
  });
});
