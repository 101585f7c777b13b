import { describe, expect, it } from "vitest";
import { createPlanGrid } from "../grid/plan-grid";
import { passExplained } from "./pass-explained";
import { LOCATOR_SETTINGS } from "./settings";
import { createSourceKernel } from "./source-kernel";

const k = LOCATOR_SETTINGS.kernel;
// still air: the near kernel only (no fans stir the gas far)
const still = createSourceKernel(k.screeningLengthM, k.nearCutoffM, k.truncationM);
const grid = createPlanGrid(12, 4, 0.25, []);

function pass(points: { x: number; y: number; ppm: number }[]) {
  return {
    xs: Float64Array.from(points, (p) => p.x),
    ys: Float64Array.from(points, (p) => p.y),
    ppm: Float64Array.from(points, (p) => p.ppm),
    // the locator's noise model (pipeline/numbers.ts readingWeights)
    w: Float64Array.from(points, (p) => 1 / (0.6 + 0.15 * p.ppm) ** 2),
  };
}

describe("how well a pass's own air explains its readings", () => {
  it("explains nearly all of a pass that rises to a peak and falls along a front as one source would", () => {
    // 0.5 ppm of background and a source 0.3 m behind the front at x = 6 m, read 0.6 m apart
    const front = Array.from({ length: 9 }, (_, i) => {
      const x = 3.6 + i * 0.6;
      return { x, y: 1.2, ppm: 0.5 + 20 * still.at(Math.hypot(x - 6, 0.3)) };
    });
    expect(passExplained(grid, pass(front), still, k.mapSigmaM, null)).toBeGreaterThan(0.95);
  });

  it("explains none of a pass whose readings all sit at one tap (zeros, then a rise): no source tells them apart", () => {
    const oneTap = [0, 0, 0, 0, 3].map((ppm) => ({ x: 6, y: 1.2, ppm }));
    expect(passExplained(grid, pass(oneTap), still, k.mapSigmaM, null)).toBeLessThan(1e-6);
  });

  it("explains little of readings that scatter along the front with no peak a source would make", () => {
    const scatter = [6, 0, 5, 0, 6, 0, 5, 0, 6].map((ppm, i) => ({ x: 3.6 + i * 0.6, y: 1.2, ppm }));
    expect(passExplained(grid, pass(scatter), still, k.mapSigmaM, null)).toBeLessThan(0.5);
  });

  it("says nothing of a pass with fewer than two readings", () => {
    expect(passExplained(grid, pass([{ x: 6, y: 1.2, ppm: 9 }]), still, k.mapSigmaM, null)).toBe(0);
  });
});
