import { describe, expect, it } from "vitest";
import { cellIndexOf, createPlanGrid } from "../grid/plan-grid";
import { accumulateReadingFields } from "./reading-fields";
import { createSourceKernel } from "./source-kernel";

describe("reading fields", () => {
  // Readings every metre along a 30 m aisle; a kernel truncated at 6 m (source-kernel.ts).
  const grid = createPlanGrid(30, 4, 0.25, []);
  const xs = Float64Array.from({ length: 29 }, (_, i) => i + 1);
  const ys = new Float64Array(29).fill(2);
  const y = Float64Array.from(xs, (x) => 1 + 10 * Math.exp(-Math.abs(x - 5)));
  const w = new Float64Array(29).fill(1);
  const kernel = createSourceKernel(1.5, 0.3, 6);

  it("searched from some readings only, is the full field wherever the others are out of reach", () => {
    const full = accumulateReadingFields(grid, xs, ys, y, w, kernel, 0.75);
    const searched = Uint8Array.from(xs, (x) => (x <= 10 ? 1 : 0));
    const part = accumulateReadingFields(grid, xs, ys, y, w, kernel, 0.75, null, searched);
    // readings from x = 11 m on reach no cell west of x = 5 m within 6 m: the sums there are the same
    for (const x of [0.125, 2.125, 4.875]) {
      const c = cellIndexOf(grid, x, 2.125);
      expect(part.sumWG[c]).toBe(full.sumWG[c]);
      expect(part.sumWGG[c]).toBe(full.sumWGG[c]);
      expect(part.nearestReading[c]).toBe(full.nearestReading[c]);
    }
    // far from every searched reading there is nothing, while the full field has the readings there
    const far = cellIndexOf(grid, 22.125, 2.125);
    expect(part.sumWG[far]).toBe(0);
    expect(part.nearestReading[far]).toBe(Infinity);
    expect(full.sumWG[far]).toBeGreaterThan(0);
    // a partial field draws no map: the full field's does
    expect(part.omega.every((v) => v === 0)).toBe(true);
    expect(full.omega[cellIndexOf(grid, 2.125, 2.125)]).toBeGreaterThan(0);
    // every reading keeps its group; the unsearched ones hold no entries
    expect(part.groupOfReading.length).toBe(29);
    const g = part.groupOfReading[20];
    expect(part.start[g + 1] - part.start[g]).toBe(0);
    const g0 = part.groupOfReading[0];
    expect(part.start[g0 + 1] - part.start[g0]).toBe(
      full.start[full.groupOfReading[0] + 1] - full.start[full.groupOfReading[0]],
    );
  });

  it("focused on a circle, keeps the full field's sums, entries and nearest reading there and nothing elsewhere", () => {
    const full = accumulateReadingFields(grid, xs, ys, y, w, kernel, 0.75);
    const focus = { x: 5, y: 2, radiusM: 3 };
    const part = accumulateReadingFields(grid, xs, ys, y, w, kernel, 0.75, null, new Uint8Array(29).fill(1), focus);
    const h = grid.cellSize;
    let inside = 0;
    for (let c = 0; c < grid.width * grid.height; c++) {
      const i = c % grid.width;
      const j = (c - i) / grid.width;
      if (((i + 0.5) * h - focus.x) ** 2 + ((j + 0.5) * h - focus.y) ** 2 <= 9) {
        inside++;
        expect(part.sumWG[c]).toBe(full.sumWG[c]);
        expect(part.sumWGG[c]).toBe(full.sumWGG[c]);
        expect(part.nearestReading[c]).toBe(full.nearestReading[c]);
      } else {
        expect(part.sumWG[c]).toBe(0);
        expect(part.nearestReading[c]).toBe(Infinity);
      }
    }
    expect(inside).toBeGreaterThan(300);
    // each group's entries are the full field's inside the circle, in the same order
    for (let g = 0; g < full.groupCell.length; g++) {
      const want: number[] = [];
      for (let e = full.start[g]; e < full.start[g + 1]; e++) if (part.sumWG[full.cell[e]] > 0) want.push(full.cell[e]);
      expect(Array.from(part.cell.subarray(part.start[g], part.start[g + 1]))).toEqual(want);
    }
  });
});
