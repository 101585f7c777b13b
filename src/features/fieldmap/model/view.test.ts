import { describe, expect, it } from "vitest";
import { fitView, focusView, spotAt, toPx } from "./view";

describe("map view", () => {
  it("fits the plan inside the canvas, centred, keeping its aspect", () => {
    const v = fitView(60, 36, 916, 556, 8);
    // (916 − 16) / 60 = 15 px/m and (556 − 16) / 36 = 15 px/m
    expect(v.zoom).toBe(15);
    expect(toPx(v, 0, 0)).toEqual([8, 8]);
    expect(toPx(v, 60, 36)).toEqual([908, 548]);
  });

  it("zooms to a suspect spot: the spot lands in the middle and its radius fills about a quarter", () => {
    const base = fitView(60, 36, 900, 540, 0);
    const v = focusView(12, 9, 2, 900, 540, base);
    expect(toPx(v, 12, 9)).toEqual([450, 270]);
    // a quarter of 540 px over a 2 m radius: 67.5 px/m
    expect(v.zoom).toBeCloseTo(540 / 4 / 2, 9);
    // never zooms out past the whole plan, nor in past 8×
    expect(focusView(12, 9, 100, 900, 540, base).zoom).toBe(base.zoom);
    expect(focusView(12, 9, 0.01, 900, 540, base).zoom).toBe(base.zoom * 8);
  });

  it("finds the suspect spot under a click, by its ring or its number", () => {
    const v = fitView(60, 36, 900, 540, 0); // 15 px/m
    const spots = [
      { rank: 1, x: 10, y: 10, radius: 1 },
      { rank: 2, x: 30, y: 10, radius: 2 },
    ];
    expect(spotAt(v, 150, 150, spots)).toBe(1); // the centre of spot 1
    // spot 2's badge sits at the ring's upper right: (450 + 30·0.71, 150 − 30·0.71)
    expect(spotAt(v, 450 + 21.3, 150 - 21.3, spots)).toBe(2);
    expect(spotAt(v, 600, 400, spots)).toBeNull();
  });
});
