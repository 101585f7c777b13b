import { describe, expect, it } from "vitest";
import { polygonArea } from "../../../../server/analysis/geometry/polygon-area";
import { bakeAffine, nodeAffine } from "./bake-transform";
import { closeTo, rect } from "./test-builders";

describe("baking a node transform into vertices", () => {
  it("is the identity for an untouched node", () => {
    expect(bakeAffine(rect(1, 2, 3, 1), nodeAffine(0, 0, 0, 1, 1))).toEqual(rect(1, 2, 3, 1));
  });
  it("scales about the node origin, then moves", () => {
    // A 2 m × 1 m case stretched to 3 m × 2 m and moved 1 m right.
    expect(closeTo(bakeAffine(rect(0, 0, 2, 1), nodeAffine(1, 0, 0, 1.5, 2)), rect(1, 0, 3, 2))).toBe(true);
  });
  it("rotates clockwise on the y-down plan, keeping the area", () => {
    // 90° clockwise on screen maps (x, y) → (−y, x) (rotation matrix, y axis pointing down).
    const out = bakeAffine([[1, 0], [2, 0], [2, 1]], nodeAffine(0, 0, 90, 1, 1));
    expect(closeTo(out, [[0, 1], [0, 2], [-1, 2]])).toBe(true);
    expect(Math.abs(polygonArea(out))).toBeCloseTo(0.5, 12);
  });
  it("refuses a transform that folds the outline flat or is not finite", () => {
    expect(() => bakeAffine(rect(0, 0, 1, 1), nodeAffine(0, 0, 0, 0, 1))).toThrow(/flat/);
    expect(() => bakeAffine(rect(0, 0, 1, 1), [1, 0, 0, 1, NaN, 0])).toThrow(/finite/);
  });
});
