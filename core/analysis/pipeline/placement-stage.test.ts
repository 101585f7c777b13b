import { describe, expect, it } from "vitest";
import { misfitRadius } from "./placement-stage";

describe("misfit radius", () => {
  it("is the radius of a disc as large as the cells within the tolerance of the peak", () => {
    // 5 x 5 cells of 0.5 m: the peak and its four neighbours lie within 2 of the top
    const delta = new Float64Array(25);
    delta[12] = 10;
    for (const k of [7, 11, 13, 17]) delta[k] = 9;
    for (const k of [6, 8, 16, 18]) delta[k] = 5;
    expect(misfitRadius(delta, 12, 2, 5, 0.5)).toBeCloseTo(Math.sqrt((5 * 0.25) / Math.PI), 12);
    expect(misfitRadius(delta, 12, 6, 5, 0.5)).toBeCloseTo(Math.sqrt((9 * 0.25) / Math.PI), 12);
  });
});
