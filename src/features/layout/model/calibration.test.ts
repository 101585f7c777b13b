import { describe, expect, it } from "vitest";
import { applySimilarity } from "#core/analysis/geometry/similarity";
import { metresPerPixelFromLine, pickScaleBar, planRecalibration, rescaleFixtures } from "./calibration";
import { imagePoint } from "../../../lib/plan-view/coordinates";
import { openCase, rect, room, valve } from "./test-builders";

describe("metresPerPixelFromLine", () => {
  it("gives 0.01524 m/px for a 10 ft line of 200 px", () => {
    // 10 ft × 0.3048 m/ft (exact, NIST SP 811 B.8) = 3.048 m; 3.048 m / 200 px = 0.01524 m/px.
    expect(metresPerPixelFromLine(imagePoint(50, 80), imagePoint(250, 80), { value: 10, unit: "ft" })).toBeCloseTo(
      0.01524,
      15,
    );
  });
  it("measures a diagonal line by its length (3-4-5 triangle)", () => {
    // 300 px by 400 px is 500 px long; 5 m over it is 0.01 m/px.
    expect(metresPerPixelFromLine(imagePoint(0, 0), imagePoint(300, 400), { value: 5, unit: "m" })).toBeCloseTo(
      0.01,
      15,
    );
  });
  it("refuses a zero length and a line too short to trust", () => {
    expect(() => metresPerPixelFromLine(imagePoint(0, 0), imagePoint(200, 0), { value: 0, unit: "m" })).toThrow(
      "the real length must be more than 0 m",
    );
    expect(() => metresPerPixelFromLine(imagePoint(0, 0), imagePoint(3, 4), { value: 1, unit: "ft" })).toThrow(
      /5\.0 px long/,
    );
  });
});

describe("re-calibration", () => {
  it("rescales fixtures in place when the plan has no sweeps", () => {
    const r = planRecalibration(0.02, 0.03, false);
    expect(r).toEqual({ kind: "rescale-in-place", factor: 1.5 });
    const [c, w, v] = rescaleFixtures(
      [openCase(1, rect(2, 2, 4, 1)), room(2, rect(10, 10, 4, 3), { edge: 0, offset: 1, width: 1 }), valve(3, 2, 4)],
      r.factor,
    );
    expect("polygon" in c && c.polygon).toEqual([
      [3, 3],
      [9, 3],
      [9, 4.5],
      [3, 4.5],
    ]);
    expect("door" in w && w.door).toEqual({ edge: 0, offset: 1.5, width: 1.5 });
    expect("point" in v && v.point).toEqual({ x: 3, y: 6 });
  });
  it("makes a new version aligned by the scale change when sweeps exist", () => {
    const r = planRecalibration(0.02, 0.025, true);
    expect(r.kind).toBe("new-version");
    if (r.kind !== "new-version") return;
    // A point 100 px from the origin was 2 m and is now 2.5 m.
    const [x, y] = applySimilarity(r.alignment, [2, 0]);
    expect(x).toBeCloseTo(2.5, 12);
    expect(y).toBeCloseTo(0, 12);
  });
});

describe("pickScaleBar", () => {
  it("picks the longest 1-2-5 length that fits", () => {
    // 0.05 m per screen px, at most 150 px → at most 7.5 m → 5 m, 100 px.
    expect(pickScaleBar(0.05, 150, "m")).toEqual({ value: 5, unit: "m", metres: 5, pixels: 100 });
    // 0.3048 m per px (1 ft per px), at most 150 px → 150 ft → 100 ft.
    const ft = pickScaleBar(0.3048, 150, "ft");
    expect(ft.value).toBe(100);
    expect(ft.pixels).toBeCloseTo(100, 9);
    expect(pickScaleBar(0.001, 150, "m").value).toBe(0.1);
    expect(pickScaleBar(0.002, 150, "m").value).toBe(0.2);
  });
});
