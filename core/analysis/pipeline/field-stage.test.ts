import { describe, expect, it } from "vitest";
import { kernelColumn } from "../locator/reading-fields";
import { LOCATOR_SETTINGS } from "../locator/settings";
import { fieldStage } from "./field-stage";
import { lagStage } from "./lag-stage";
import { aisle, gridOf } from "./stage-fixtures";

function run(ppm: number[], zoneOfReading = new Int32Array(ppm.length).fill(-1), fansStir = false) {
  const input = aisle(ppm);
  const grid = gridOf(input);
  const lag = lagStage(input.readings, input.instrument, grid, 0);
  return { grid, field: fieldStage(grid, null, fansStir, lag, { zoneOfReading }, LOCATOR_SETTINGS) };
}

describe("field stage", () => {
  it("takes the background as the lower quartile of the readings no zone explains", () => {
    // sorted 1,1,1,1,2,2,2,2,3,3,9,9: the lower quartile (linear between order statistics, position
    // (n − 1)·0.25 = 2.75, as simple-statistics' quantileSorted computes it) is 1
    expect(run([1, 2, 3, 9, 9, 3, 2, 2, 2, 1, 1, 1]).field.background.ppm).toBe(1);
    // without the eight readings a zone explains, 2 3 9 9 remain: position 0.75, so 2 + 0.75·(3 − 2)
    const zoneOf = Int32Array.from([0, 0, 0, 0, -1, -1, -1, -1, 0, 0, 0, 0]);
    expect(run([1, 1, 1, 1, 9, 9, 3, 2, 1, 1, 1, 1], zoneOf).field.background.ppm).toBe(2.75);
  });

  it("weighs readings by the noise model 1/(a + βy)²", () => {
    const { field } = run(new Array(12).fill(4));
    const { floorPpm, fraction } = LOCATOR_SETTINGS.noise;
    expect(field.weights[0]).toBeCloseTo(1 / (floorPpm + fraction * 4) ** 2, 12);
  });

  it("draws the map near the readings only and leaves the rest unknown", () => {
    const { grid, field } = run(new Array(12).fill(3));
    const at = (x: number, y: number) => Math.floor(y / 0.25) * grid.width + Math.floor(x / 0.25);
    expect(field.map.values[at(6, 2)]).toBeCloseTo(3, 5);
    expect(field.map.confidence[at(6, 2)]).toBeGreaterThan(0.9);
    // 2 m off the walked line is within 3σ (2.25 m) of a reading; the map has no corner beyond it here,
    // so check the edge rows: both are sampled, with lower confidence than the line itself
    expect(field.map.confidence[at(6, 0.1)]).toBeLessThan(field.map.confidence[at(6, 2)]);
  });

  it("gives the kernel its far-field part only where fans stir the air", () => {
    expect(run(new Array(12).fill(1), undefined, true).field.kernel.farShare).toBe(LOCATOR_SETTINGS.kernel.farShare);
    expect(run(new Array(12).fill(1), undefined, false).field.kernel.farShare).toBe(0);
  });
});

describe("field stage with readings in other air (a pinpoint pass)", () => {
  it("searches each reading with its own air's kernel and fits them as one set of readings", () => {
    const input = aisle([1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1]);
    const grid = gridOf(input);
    const lag = lagStage(input.readings, input.instrument, grid, 0);
    const zoneOfReading = new Int32Array(12).fill(-1);
    // the first six taps with the fans running, the last six in still air
    const modelOfReading = Int32Array.from({ length: 12 }, (_, i) => (i < 6 ? 0 : 1));
    const field = fieldStage(grid, null, true, lag, { zoneOfReading }, LOCATOR_SETTINGS, null, {
      models: [{ fansStir: false, stepScale: null }],
      modelOfReading,
    });
    expect(field.kernels.map((k) => k.farShare)).toEqual([LOCATOR_SETTINGS.kernel.farShare, 0]);
    expect(field.kernel).toBe(field.kernels[0]);
    // each reading's kernel value at a cell is its own air's kernel at the searched distance
    const f = field.fields;
    const c = Math.floor(0.5 / 0.25) * grid.width + Math.floor(6 / 0.25);
    const entryAt = (i: number) => {
      const g = f.groupOfReading[i];
      for (let e = f.start[g]; e < f.start[g + 1]; e++) if (f.cell[e] === c) return e;
      throw new Error(`reading ${i} does not reach the cell`);
    };
    for (const i of [2, 5, 6, 9]) {
      const e = entryAt(i);
      expect(f.kernel[e]).toBeCloseTo(field.kernels[modelOfReading[i]].at(f.dist[e]), 6);
    }
    const col = kernelColumn(f, c, 12);
    expect(col[5]).toBeGreaterThan(col[6]); // taps 5 and 6 (x = 5.5 and 6.5) about as far, the still one lower
    // with every reading in the plan's air the result is the plain field stage's
    const plain = fieldStage(grid, null, true, lag, { zoneOfReading }, LOCATOR_SETTINGS);
    const same = fieldStage(grid, null, true, lag, { zoneOfReading }, LOCATOR_SETTINGS, null, {
      models: [{ fansStir: false, stepScale: null }],
      modelOfReading: new Int32Array(12),
    });
    expect(Array.from(same.fields.sumWG)).toEqual(Array.from(plain.fields.sumWG));
    expect(Array.from(same.map.values)).toEqual(Array.from(plain.map.values));
  });
});
