import { describe, expect, it } from "vitest";
import { fitClearOfControls, WALK_CONTROLS, zoomRowBox } from "./walk-fit";

type Box = { left: number; top: number; right: number; bottom: number };

function planBox(widthM: number, heightM: number, w: number, h: number): Box {
  const v = fitClearOfControls(widthM, heightM, w, h);
  return { left: v.panX, top: v.panY, right: v.panX + widthM * v.zoom, bottom: v.panY + heightM * v.zoom };
}

function overlaps(a: Box, b: Box): boolean {
  return a.left < b.right && b.left < a.right && a.top < b.bottom && b.top < a.bottom;
}

function controls(w: number): Box[] {
  const c = WALK_CONTROLS;
  const row = zoomRowBox(w);
  return [
    { left: row.x, top: row.y, right: row.x + row.width, bottom: row.y + row.height },
    { left: c.insetPx, top: c.insetPx, right: c.insetPx + c.keyWidthPx, bottom: c.insetPx + c.buttonPx },
  ];
}

// Boxes the plan gets: a 390 × 844 phone without and with the keypad open, a landscape phone,
// portrait and landscape tablets, a laptop (the screen sizes of the browser tests).
const BOXES = [
  [390, 640],
  [390, 300],
  [844, 250],
  [820, 1000],
  [1180, 640],
  [1366, 700],
];
// The invented demo store (60 m × 36 m), a long narrow one and a tall one.
const PLANS = [
  [60, 36],
  [120, 20],
  [20, 80],
];

describe("the Walk screen's whole-plan fit", () => {
  it("keeps every plan clear of the Key button and the zoom row at every screen size", () => {
    for (const [w, h] of BOXES)
      for (const [pw, ph] of PLANS) {
        const plan = planBox(pw, ph, w, h);
        for (const c of controls(w)) expect(overlaps(plan, c), `${pw}×${ph} m in ${w}×${h} px`).toBe(false);
        // And inside the box.
        expect(plan.left).toBeGreaterThanOrEqual(0);
        expect(plan.top).toBeGreaterThanOrEqual(0);
        expect(plan.right).toBeLessThanOrEqual(w);
        expect(plan.bottom).toBeLessThanOrEqual(h);
      }
  });

  it("on a phone the demo store fills the width under the buttons", () => {
    const v = fitClearOfControls(60, 36, 390, 640);
    // 390 px less 12 px each side over 60 m.
    expect(v.zoom).toBeCloseTo(366 / 60, 9);
    expect(v.panY).toBeGreaterThanOrEqual(WALK_CONTROLS.insetPx + WALK_CONTROLS.buttonPx);
  });

  it("puts a tall plan in a wide box between the buttons, larger than under them", () => {
    const v = fitClearOfControls(20, 80, 1180, 400);
    // Full height less 12 px each side.
    expect(v.zoom).toBeCloseTo(376 / 80, 9);
    expect(v.panY).toBeCloseTo(12, 9);
  });

  it("refuses a plan without a size", () => {
    expect(() => fitClearOfControls(0, 10, 390, 640)).toThrow(/width and a height/);
  });
});
