import { describe, expect, it } from "vitest";
import { createPlanGrid } from "../grid/plan-grid";
import { besselK0 } from "./bessel-k0";
import type { FoundSource } from "./greedy-sources";
import { accumulateReadingFields, kernelColumn } from "./reading-fields";
import { createSourceKernel } from "./source-kernel";
import { upwindReplace, type UpwindInput } from "./upwind-replace";

// An open 14 m x 8 m floor, a leak at (4, 4) in a strong eastward drift (a = 1 per metre: the gas
// trails east along the passes, the upwind edge is sharp), readings on passes 1 m either side of it.
// The readings follow the closed form of local-drift.ts at Euclidean distance, plus a 1 ppm background.
const grid = createPlanGrid(14, 8, 0.25, []);
const xs: number[] = [];
const ys: number[] = [];
for (const py of [3, 5])
  for (let x = 0.5; x <= 13.5; x += 0.3) {
    xs.push(x);
    ys.push(py);
  }
const L = 1.5;
const a = 1;
const kappa = Math.sqrt(a * a + 1 / L ** 2);
const y = Float64Array.from(xs, (x, i) => {
  const dx = x - 4,
    dy = ys[i] - 4;
  return 1 + (20 * Math.exp(a * dx) * besselK0(kappa * Math.max(0.3, Math.hypot(dx, dy)))) / besselK0(kappa * 0.3);
});
const n = y.length;
const w = new Float64Array(n).fill(1);
const fields = accumulateReadingFields(
  grid,
  Float64Array.from(xs),
  Float64Array.from(ys),
  y,
  w,
  createSourceKernel(L, 0.3, 6),
  0.75,
);
const cellAt = (x: number, yy: number) => Math.floor(yy / 0.25) * grid.width + Math.floor(x / 0.25);
const centre = (c: number): [number, number] => [
  ((c % grid.width) + 0.5) * 0.25,
  (Math.floor(c / grid.width) + 0.5) * 0.25,
];
const source = (x: number, yy: number, alternate = false): FoundSource => {
  const cell = cellAt(x, yy);
  return { cell, delta: 100, column: kernelColumn(fields, cell, n), alternate, q: 1, surface: new Float64Array(0) };
};
const input = (over: Partial<UpwindInput> = {}): UpwindInput => ({
  fields,
  y,
  w,
  censored: new Uint8Array(n),
  nuisance: [],
  allowed: new Uint8Array(grid.width * grid.height).fill(1),
  prior: null,
  gridWidth: grid.width,
  cellSize: grid.cellSize,
  windowM: 6,
  minMoveM: 0,
  minGain: 0,
  separationM: 4,
  drift: { screeningLengthM: L, nearCutoffM: 0.3, truncationM: 6, strengths: [0.4, 1, 2], penalty: 3 },
  ...over,
});

describe("the first spot placed again with a strong drift", () => {
  it("moves a spot found downwind of a trailing plume back to the leak at its upwind edge", () => {
    // where a kernel with no drift would put it: 3 m downwind, on the plume's long tail
    const [moved] = upwindReplace(input(), [source(7, 4)]);
    const [x, yy] = centre(moved.cell);
    expect(Math.hypot(x - 4, yy - 4)).toBeLessThan(0.4);
    // its column and surface are the drifted fit's, for the refinement and the radius after it
    expect(moved.surface.length).toBe(grid.width * grid.height);
    expect(moved.surface[moved.cell]).toBe(moved.delta);
    // with no drift allowed the same search stays on the tail, downwind of the leak
    const [still] = upwindReplace(input({ drift: { ...input().drift, penalty: 1e9 } }), [source(7, 4)]);
    expect(centre(still.cell)[0] - 4).toBeGreaterThan(1);
  });

  it("looks only within the window around the spot", () => {
    const [moved] = upwindReplace(input({ windowM: 1.5 }), [source(7, 4)]);
    const [x, yy] = centre(moved.cell);
    expect(Math.hypot(x - 7, yy - 4)).toBeLessThanOrEqual(1.5 + 1e-9);
  });

  it("keeps another fitted source's distance and leaves every other spot as it was", () => {
    const other = source(2, 4);
    const found = [source(7, 4), other, source(11, 4, true)];
    const out = upwindReplace(input(), found);
    const [x, yy] = centre(out[0].cell);
    expect(Math.hypot(x - 2, yy - 4)).toBeGreaterThanOrEqual(4);
    expect(out[1]).toBe(other);
    expect(out[2]).toBe(found[2]);
  });

  it("leaves the list alone when the first spot is an alternative or no cell may hold it", () => {
    const alt = [source(7, 4, true), source(2, 4)];
    expect(upwindReplace(input(), alt)).toEqual(alt);
    const none = [source(7, 4)];
    expect(upwindReplace(input({ allowed: new Uint8Array(grid.width * grid.height) }), none)).toEqual(none);
  });

  it("keeps a spot on a plume spread evenly both ways along the line, which a drifted kernel fits only a little better", () => {
    // no drift: gas spread along the passes by air curtains, a Gaussian of 3 m either way of (7, 4)
    const even = Float64Array.from(
      xs,
      (x, i) => 1 + 10 * Math.exp(-((x - 7) ** 2) / 18) * Math.exp(-Math.abs(ys[i] - 4)),
    );
    const evenFields = accumulateReadingFields(
      grid,
      Float64Array.from(xs),
      Float64Array.from(ys),
      even,
      w,
      createSourceKernel(L, 0.3, 6),
      0.75,
    );
    const at = cellAt(7, 4);
    const spot: FoundSource = { ...source(7, 4), column: kernelColumn(evenFields, at, n) };
    const loose = upwindReplace(input({ fields: evenFields, y: even, minMoveM: 1.5 }), [spot]);
    expect(Math.hypot(...centre(loose[0].cell).map((v, k) => v - [7, 4][k]))).toBeGreaterThanOrEqual(1.5);
    const kept = upwindReplace(input({ fields: evenFields, y: even, minMoveM: 1.5, minGain: 8 }), [spot]);
    expect(kept[0]).toBe(spot);
  });
});
