import { describe, expect, it } from "vitest";
import { fitView } from "../../../lib/plan-view/coordinates";
import { ALARM_DOT_FACTOR, readingDotRadiusPx } from "./plan-marks";
import { WALK_ZOOM } from "./walk-view";

describe("reading dots sized by zoom", () => {
  it("keeps readings a sniffing spacing apart from merging at a phone's whole-store view", () => {
    // The demo store (60 m × 36 m) fitted to a 390 px wide phone's plan box (about 300 px tall with
    // the keypad open) as the Walk screen fits it (12 px margin).
    const { zoom } = fitView(60, 36, 390, 300, 12, WALK_ZOOM);
    expect(zoom).toBeCloseTo(6.1, 1);
    // Readings 1.3 m apart (a close case-line spacing; common practice, no published source): two
    // alarm dots side by side still leave a gap between them.
    const centres = 1.3 * zoom;
    expect(2 * readingDotRadiusPx(zoom) * ALARM_DOT_FACTOR).toBeLessThan(centres);
    // The old fixed 7 px radius merged them.
    expect(2 * 7).toBeGreaterThan(centres);
  });

  it("grows to a thumb's mark when zoomed in and never shrinks below a visible dot", () => {
    expect(readingDotRadiusPx(60)).toBe(7);
    expect(readingDotRadiusPx(2)).toBe(2.5);
    expect(readingDotRadiusPx(15)).toBeCloseTo(4.5, 10);
  });
});
