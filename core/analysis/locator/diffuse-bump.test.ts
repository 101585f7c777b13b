import { describe, expect, it } from "vitest";
import { createPlanGrid } from "../grid/plan-grid";
import { broadKernel, diffuseBump, pointOverBroad } from "./diffuse-bump";
import { createSourceKernel } from "./source-kernel";

// A 40 m aisle walked along y = 2, one reading a metre; a candidate source at x = 20.
const grid = createPlanGrid(40, 4, 0.25, []);
const xs = Array.from({ length: 40 }, (_, i) => i + 0.5);
const cellOf = (x: number, y: number) => Math.floor(y / 0.25) * grid.width + Math.floor(x / 0.25);
const readingCell = Int32Array.from(xs, (x) => cellOf(x, 2));
const source = cellOf(20, 2);
const w = new Float64Array(xs.length).fill(1);
const censored = new Uint8Array(xs.length);
const point = createSourceKernel(1.5, 0.3, 6);
const pointColumn = Float64Array.from(xs, (x) => point.at(Math.abs(x - 20.125)));
const bump = diffuseBump(grid, null, readingCell, broadKernel(5));

describe("a point source against a broad bump", () => {
  it("draws the broad kernel as a Gaussian of walking distance, zero past 3σ", () => {
    const k = broadKernel(5);
    expect(k.at(0)).toBe(1);
    expect(k.at(5)).toBeCloseTo(Math.exp(-0.5), 12);
    expect(k.at(15)).toBe(0);
    const column = bump.column(source);
    // the cell of the reading at x = 30.5 (centre 30.625) is 10.5 m from the source cell (centre 20.125)
    expect(column[30]).toBeCloseTo(Math.exp(-0.5 * (10.5 / 5) ** 2), 6);
  });

  it("saves little χ² where readings rise gently over tens of metres (no peak)", () => {
    // 1 ppm lifted by up to 2 ppm over ±10 m: the uneven gas of a benign source spread by fans
    const gentle = Float64Array.from(xs, (x) => 1 + 2 * Math.exp(-0.5 * ((x - 20) / 6) ** 2));
    const overFlat = pointOverBroad(gentle, w, censored, new Float64Array(xs.length), pointColumn);
    const overBroad = pointOverBroad(gentle, w, censored, bump.column(source), pointColumn);
    expect(overFlat).toBeGreaterThan(3);
    expect(overBroad).toBeLessThan(0.5);
  });

  it("saves most of the χ² where a leak's peak stands on a broad rise", () => {
    const leak = Float64Array.from(xs, (x, i) => 1 + 2 * Math.exp(-0.5 * ((x - 20) / 6) ** 2) + 12 * pointColumn[i]);
    expect(pointOverBroad(leak, w, censored, bump.column(source), pointColumn)).toBeGreaterThan(50);
  });
});
