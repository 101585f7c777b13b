import { describe, expect, it } from "vitest";
import { createPlanGrid } from "../grid/plan-grid";
import { besselK0 } from "./bessel-k0";
import { chooseLocalDrift, DRIFT_DIRECTIONS, driftedKernel } from "./local-drift";
import { accumulateReadingFields, sumWeightedKernelTimes } from "./reading-fields";
import { scanSources } from "./source-scan";
import { createSourceKernel } from "./source-kernel";

describe("drifted point-source kernel", () => {
  it("solves steady advection-diffusion with removal away from the source (finite differences)", () => {
    // K∇²C − u·∇C − λC = 0 for r ≠ 0, the equation the closed form claims to solve; with a = u/(2K)
    // and L² = K/λ this is ∇²C − 2a·∇C − C/L² = 0. A long truncation makes the table's shift negligible.
    const L = 1.5;
    const a: [number, number] = [0.5, -0.3];
    const g = driftedKernel(L, 0.05, 60, a);
    const C = (x: number, y: number) => g(Math.hypot(x, y), x, y);
    const h = 0.1; // wide enough that the table's 1 cm linear steps do not dominate the second differences
    for (const [x, y] of [
      [1.2, 0.4],
      [-0.9, 1.1],
      [0.3, -1.6],
      [2, 2],
    ]) {
      const cxx = (C(x + h, y) - 2 * C(x, y) + C(x - h, y)) / h ** 2;
      const cyy = (C(x, y + h) - 2 * C(x, y) + C(x, y - h)) / h ** 2;
      const cx = (C(x + h, y) - C(x - h, y)) / (2 * h);
      const cy = (C(x, y + h) - C(x, y - h)) / (2 * h);
      const residual = cxx + cyy - 2 * (a[0] * cx + a[1] * cy) - C(x, y) / L ** 2;
      const scale = Math.abs(cxx) + Math.abs(cyy) + Math.abs(C(x, y)) / L ** 2;
      expect(Math.abs(residual) / scale).toBeLessThan(1e-2); // O(h²) stencil error is about 0.3%
      // the same stencil on the drift-free decay rate (no |a|² in the Bessel argument) misses by far more
      const wrong = (p: number, q: number) => Math.exp(a[0] * p + a[1] * q) * besselK0(Math.hypot(p, q) / L);
      const wxx = (wrong(x + h, y) - 2 * wrong(x, y) + wrong(x - h, y)) / h ** 2;
      const wyy = (wrong(x, y + h) - 2 * wrong(x, y) + wrong(x, y - h)) / h ** 2;
      const wx = (wrong(x + h, y) - wrong(x - h, y)) / (2 * h);
      const wy = (wrong(x, y + h) - wrong(x, y - h)) / (2 * h);
      const wres = wxx + wyy - 2 * (a[0] * wx + a[1] * wy) - wrong(x, y) / L ** 2;
      expect(Math.abs(wres) / (Math.abs(wxx) + Math.abs(wyy) + Math.abs(wrong(x, y)) / L ** 2)).toBeGreaterThan(5e-2);
    }
  });

  it("carries gas downwind and equals the plain kernel without drift", () => {
    const g = driftedKernel(1.5, 0.3, 6, [0.8, 0]);
    expect(g(2, 2, 0)).toBeGreaterThan(3 * g(2, -2, 0));
    const plain = createSourceKernel(1.5, 0.3, 6);
    const still = driftedKernel(1.5, 0.3, 6, [0, 0]);
    for (const d of [0.1, 0.7, 2.5, 5.9]) expect(still(d, d, 0)).toBeCloseTo(plain.at(d), 6);
  });

  it("has eight unit directions, east first, 45° apart", () => {
    expect(DRIFT_DIRECTIONS[0]).toEqual([1, 0]);
    expect(DRIFT_DIRECTIONS[2]).toEqual([0, 1]);
    for (const [x, y] of DRIFT_DIRECTIONS) expect(Math.hypot(x, y)).toBeCloseTo(1, 10);
  });
});

describe("choosing a drift per candidate source", () => {
  // An open 14 m x 8 m floor, a leak at (5, 4) in an eastward drift (a = 0.8 per metre), readings on
  // passes 1 m either side of it. The readings follow the continuous closed form at Euclidean
  // distance (not the grid's geodesic table), plus a 1 ppm background.
  const grid = createPlanGrid(14, 8, 0.25, []);
  const xs: number[] = [];
  const ys: number[] = [];
  for (const py of [3, 5])
    for (let x = 0.5; x <= 13.5; x += 0.3) {
      xs.push(x);
      ys.push(py);
    }
  const L = 1.5,
    a = 0.8,
    kappa = Math.sqrt(a * a + 1 / L ** 2);
  const y = Float64Array.from(xs, (x, i) => {
    const dx = x - 5,
      dy = ys[i] - 4;
    return 1 + (20 * Math.exp(a * dx) * besselK0(kappa * Math.max(0.3, Math.hypot(dx, dy)))) / besselK0(kappa * 0.3);
  });
  const w = new Float64Array(y.length).fill(1);
  const kernel = createSourceKernel(L, 0.3, 6);
  const build = () => accumulateReadingFields(grid, Float64Array.from(xs), Float64Array.from(ys), y, w, kernel, 0.75);
  const allowed = new Uint8Array(grid.width * grid.height).fill(1);
  const bestCell = (fields: ReturnType<typeof build>) => {
    const sums = { sumW: 0, sumWR: 0, sumWRR: 0 };
    for (let i = 0; i < y.length; i++) {
      sums.sumW += w[i];
      sums.sumWR += w[i] * y[i];
      sums.sumWRR += w[i] * y[i] ** 2;
    }
    const sumWGR = sumWeightedKernelTimes(fields, w, y, new Float64Array(allowed.length));
    const scan = scanSources(fields.sumWG, fields.sumWGG, sumWGR, sums, allowed);
    let best = 0;
    for (let c = 0; c < scan.delta.length; c++) if (scan.delta[c] > scan.delta[best]) best = c;
    return [((best % grid.width) + 0.5) * 0.25, (Math.floor(best / grid.width) + 0.5) * 0.25];
  };

  it("finds the leak where the drift-free kernel puts it downwind", () => {
    const plain = build();
    const [px] = bestCell(plain);
    expect(px - 5).toBeGreaterThan(1); // without a drift the peak of the plume is taken for the leak
    const choice = chooseLocalDrift(plain, grid.width, grid.cellSize, w, y, allowed, {
      screeningLengthM: L,
      nearCutoffM: 0.3,
      truncationM: 6,
      strengths: [0.4, 0.8],
      penalty: 3,
    });
    const [dx, dy] = bestCell(choice.fields);
    // the fields given are left as they were: the plain kernel still puts the leak downwind
    expect(bestCell(plain)[0]).toBe(px);
    expect(Math.hypot(dx - 5, dy - 4)).toBeLessThan(0.5);
    const at = Math.floor(4 / 0.25) * grid.width + Math.floor(5 / 0.25);
    expect(choice.strength[at]).toBe(2); // 0.8 per metre
    expect(choice.direction[at]).toBe(0); // east
  });

  it("keeps the plain kernel where no drift beats it by the penalty", () => {
    const fields = build();
    const before = Float32Array.from(fields.kernel);
    const choice = chooseLocalDrift(fields, grid.width, grid.cellSize, w, y, allowed, {
      screeningLengthM: L,
      nearCutoffM: 0.3,
      truncationM: 6,
      strengths: [0.4, 0.8],
      penalty: 1e9,
    });
    expect(choice.strength.every((s) => s === 0)).toBe(true);
    for (let e = 0; e < before.length; e += 97) expect(choice.fields.kernel[e]).toBeCloseTo(before[e], 5);
  });

  it("chooses on a patchy set of allowed cells as a plain per-cell search over every direction does", () => {
    // The choice keeps sums for the allowed cells only; a plain search (every allowed cell, strength and
    // direction, its own kernel from the closed form, the same scan) must pick the same drift everywhere.
    const fields = build();
    const patchy = new Uint8Array(allowed.length);
    for (let c = 0; c < patchy.length; c++) patchy[c] = (c * 7919) % 5 < 3 ? 1 : 0;
    const settings = { screeningLengthM: L, nearCutoffM: 0.3, truncationM: 6, strengths: [0.4, 0.8], penalty: 3 };
    const choice = chooseLocalDrift(fields, grid.width, grid.cellSize, w, y, patchy, settings);
    const sums = { sumW: 0, sumWR: 0, sumWRR: 0 };
    for (let i = 0; i < y.length; i++) {
      sums.sumW += w[i];
      sums.sumWR += w[i] * y[i];
      sums.sumWRR += w[i] * y[i] ** 2;
    }
    const plain = scanSources(
      fields.sumWG,
      fields.sumWGG,
      sumWeightedKernelTimes(fields, w, y, new Float64Array(patchy.length)),
      sums,
      patchy,
    );
    const max = Math.max(...plain.delta);
    const bar = 3 * Math.max(1, (plain.chi2Background - max) / (y.length - 2));
    // per group the weights and weighted readings, per cell the entries that reach it
    const gw = new Float64Array(fields.groupCell.length);
    const gwr = new Float64Array(fields.groupCell.length);
    for (let i = 0; i < y.length; i++) {
      gw[fields.groupOfReading[i]] += w[i];
      gwr[fields.groupOfReading[i]] += w[i] * y[i];
    }
    const reaching = new Map<number, [number, number][]>();
    for (let gi = 0; gi < fields.groupCell.length; gi++)
      for (let e = fields.start[gi]; e < fields.start[gi + 1]; e++) {
        const list = reaching.get(fields.cell[e]) ?? [];
        list.push([gi, e]);
        reaching.set(fields.cell[e], list);
      }
    const kernels = settings.strengths.map((a) =>
      DRIFT_DIRECTIONS.map(([ux, uy]) => driftedKernel(L, 0.3, 6, [a * ux, a * uy])),
    );
    let drifted = 0;
    for (let c = 0; c < patchy.length; c++) {
      if (!patchy[c]) {
        expect(choice.strength[c]).toBe(0);
        continue;
      }
      const cx = ((c % grid.width) + 0.5) * 0.25;
      const cy = (Math.floor(c / grid.width) + 0.5) * 0.25;
      let best = plain.delta[c] + bar;
      let pick = [0, 0];
      kernels.forEach((row, si) =>
        row.forEach((g, k) => {
          let swg = 0,
            swgg = 0,
            swgr = 0;
          for (const [gi, e] of reaching.get(c) ?? []) {
            const v = g(fields.dist[e], fields.groupX[gi] - cx, fields.groupY[gi] - cy);
            swg += gw[gi] * v;
            swgg += gw[gi] * v * v;
            swgr += gwr[gi] * v;
          }
          const one = scanSources(
            Float64Array.of(swg),
            Float64Array.of(swgg),
            Float64Array.of(swgr),
            sums,
            Uint8Array.of(1),
          );
          if (one.delta[0] > best) {
            best = one.delta[0];
            pick = [si + 1, k];
          }
        }),
      );
      expect([c, choice.strength[c], pick[0] ? choice.direction[c] : 0]).toEqual([c, pick[0], pick[1]]);
      if (pick[0]) drifted++;
    }
    expect(drifted).toBeGreaterThan(20); // the plume's cells do take a drift
  });

  it("names the field and the reason for bad settings", () => {
    expect(() =>
      chooseLocalDrift(build(), grid.width, grid.cellSize, w, y, allowed, {
        screeningLengthM: L,
        nearCutoffM: 0.3,
        truncationM: 6,
        strengths: [0.4, -1],
        penalty: 3,
      }),
    ).toThrow(/drift strength must be positive/);
  });
});
