import { describe, expect, it } from "vitest";
import { createPlanGrid } from "../grid/plan-grid";
import { mergeReadingFields } from "./merge-reading-fields";
import { accumulateReadingFields, kernelColumn } from "./reading-fields";
import { createSourceKernel } from "./source-kernel";

const grid = createPlanGrid(8, 4, 0.25, []);
const xs = Float64Array.from([1.1, 2.6, 4.1, 5.6, 4.1]);
const ys = Float64Array.from([2, 2, 2, 2, 2]);
const ppm = Float64Array.from([1, 3, 9, 3, 8]);
const w = Float64Array.from([1, 0.5, 0.2, 0.5, 0.25]);
const near = createSourceKernel(1.5, 0.3, 6);
const mixed = createSourceKernel(1.5, 0.3, 6, { lengthM: 4, share: 0.3 });
const pick = (a: Float64Array, idx: number[]) => Float64Array.from(idx, (i) => a[i]);
const fieldsOf = (idx: number[], kernel = near) =>
  accumulateReadingFields(grid, pick(xs, idx), pick(ys, idx), pick(ppm, idx), pick(w, idx), kernel, 0.75);
const cells = grid.width * grid.height;

describe("merging reading fields of subsets of the readings", () => {
  it("gives the same per-cell sums and kernel columns as one search over all readings with one kernel", () => {
    const whole = fieldsOf([0, 1, 2, 3, 4]);
    const merged = mergeReadingFields(
      [
        { fields: fieldsOf([0, 2, 3]), readings: Int32Array.from([0, 2, 3]) },
        { fields: fieldsOf([1, 4]), readings: Int32Array.from([1, 4]) },
      ],
      5,
      cells,
    );
    for (let c = 0; c < cells; c++) {
      expect(merged.sumWG[c]).toBeCloseTo(whole.sumWG[c], 12);
      expect(merged.sumWGG[c]).toBeCloseTo(whole.sumWGG[c], 12);
      expect(merged.omega[c]).toBeCloseTo(whole.omega[c], 12);
      expect(merged.omegaY[c]).toBeCloseTo(whole.omegaY[c], 12);
      expect(merged.nearestReading[c]).toBe(whole.nearestReading[c]);
    }
    const c = Math.floor(2 / 0.25) * grid.width + Math.floor(4 / 0.25);
    expect(Array.from(kernelColumn(merged, c, 5))).toEqual(Array.from(kernelColumn(whole, c, 5)));
  });

  it("keeps each subset's own kernel: two readings in one cell in different air differ", () => {
    // readings 2 and 4 share a cell; 4 is read with the fans' far-field part, 2 without
    const merged = mergeReadingFields(
      [
        { fields: fieldsOf([0, 1, 2, 3]), readings: Int32Array.from([0, 1, 2, 3]) },
        { fields: fieldsOf([4], mixed), readings: Int32Array.from([4]) },
      ],
      5,
      cells,
    );
    const threeMetresOff = Math.floor(2 / 0.25) * grid.width + Math.floor(7.125 / 0.25);
    const col = kernelColumn(merged, threeMetresOff, 5);
    expect(col[4]).toBeGreaterThan(col[2]);
    expect(col[2]).toBeCloseTo(near.at(3), 2);
    expect(col[4]).toBeCloseTo(mixed.at(3), 2);
  });

  it("returns one part covering every reading in order as it is", () => {
    const whole = fieldsOf([0, 1, 2, 3, 4]);
    expect(mergeReadingFields([{ fields: whole, readings: Int32Array.from([0, 1, 2, 3, 4]) }], 5, cells)).toBe(whole);
  });

  it("refuses parts that leave a reading out", () => {
    expect(() =>
      mergeReadingFields([{ fields: fieldsOf([0, 1]), readings: Int32Array.from([0, 1]) }], 5, cells),
    ).toThrow(/a reading is in no part/);
  });
});
