import { describe, expect, it } from "vitest";
import { fitView, focusView, toPx } from "./view";

describe("map view", () => {
  it("fits the plan inside the canvas, centred, keeping its aspect", () => {
    const v = fitView(60, 36, 916, 556, 8);
    // (916 − 16) / 60 = 15 px/m and (556 − 16) / 36 = 15 px/m
    expect(v.scale).toBe(15);
    expect(toPx(v, 0, 0)).toEqual([8, 8]);
    expect(toPx(v, 60, 36)).toEqual([908, 548]);
  });

  it("zooms to a suspect spot: the spot lands in the middle and its radius fills about a quarter", () => {
    const base = fitView(60, 36, 900, 540, 0);
    const v = focusView(12, 9, 1, 900, 540, base);
    expect(toPx(v, 12, 9)).toEqual([450, 270]);
    expect(v.scale).toBeCloseTo(540 / 4, 9);
    // never zooms out past the whole plan, nor in past 8×
    expect(focusView(12, 9, 100, 900, 540, base).scale).toBe(base.scale);
    expect(focusView(12, 9, 0.01, 900, 540, base).scale).toBe(base.scale * 8);
  });
});
