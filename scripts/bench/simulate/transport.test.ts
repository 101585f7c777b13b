import { describe, expect, it } from "vitest";
import { createGrid, fillRect, type Grid } from "./grid";
import { buildOperator, solveSteady } from "./transport";
import { potentialDrift, terminalFlows } from "./drift";

// Modified Bessel function K0 by the polynomial approximations of Abramowitz & Stegun (1964),
// 9.8.1 (I0), 9.8.5 (K0, 0 < x <= 2) and 9.8.6 (K0, x >= 2); |error| < 1e-7 and 1.9e-7 respectively.
function besselI0(x: number): number {
  const t = (x / 3.75) ** 2;
  return 1 + t * (3.5156229 + t * (3.0899424 + t * (1.2067492 + t * (0.2659732 + t * (0.0360768 + t * 0.0045813)))));
}
function besselK0(x: number): number {
  if (x <= 2) {
    const t = (x / 2) ** 2;
    return (
      -Math.log(x / 2) * besselI0(x) -
      0.57721566 +
      t * (0.4227842 + t * (0.23069756 + t * (0.0348859 + t * (0.00262698 + t * (0.0001075 + t * 0.0000074)))))
    );
  }
  const t = 2 / x;
  return (
    (Math.exp(-x) / Math.sqrt(x)) *
    (1.25331414 +
      t * (-0.07832358 + t * (0.02189568 + t * (-0.01062446 + t * (0.00587872 + t * (-0.0025154 + t * 0.00053208))))))
  );
}

const uniform = (grid: Grid, k: number) => new Float64Array(grid.nx * grid.ny).fill(k);

describe("steady transport against closed forms", () => {
  it("K0 approximation matches tabulated values", () => {
    // Abramowitz & Stegun Table 9.8: K0(1) = 0.4210244382, K0(2) = 0.1138938727.
    expect(besselK0(1)).toBeCloseTo(0.4210244, 6);
    expect(besselK0(2)).toBeCloseTo(0.1138939, 6);
  });

  it("a point source in open air approaches the screened 2-D solution Q/(2 pi K) K0(r/L)", () => {
    // Free-space Green's function of K lap C - lambda C = -Q delta (K0 per A&S 9.6/9.8; the 2-D screened-diffusion kernel, Carslaw & Jaeger, Conduction of Heat in Solids, 1959).
    const grid = createGrid(24, 24, 0.12);
    const K = 0.05,
      lambda = 0.005,
      Q = 1;
    const L = Math.sqrt(K / lambda);
    const op = buildOperator(grid, uniform(grid, K), lambda);
    const src = new Float64Array(grid.nx * grid.ny);
    const c = Math.floor(grid.nx / 2);
    src[c * grid.nx + c] = Q / (grid.h * grid.h);
    const { field } = solveSteady(op, src, 1e-10);
    for (const cellsAway of [8, 17, 25]) {
      const r = cellsAway * grid.h;
      const expected = (Q / (2 * Math.PI * K)) * besselK0(r / L);
      expect(Math.abs(field[c * grid.nx + c + cellsAway] / expected - 1)).toBeLessThan(0.02);
    }
  });

  it("a well-mixed room reaches C = G / (ACH V)", () => {
    // Ott, Steinemann & Wallace, Exposure Analysis (2007) ch. 18, mass-balance model; docs/reference/standards.md §7.
    const grid = createGrid(4, 3, 0.1);
    const ach = 2 / 3600,
      G = 0.3; // G in concentration x area per second (2-D, per metre of depth)
    const op = buildOperator(grid, uniform(grid, 2.0), ach);
    const src = new Float64Array(grid.nx * grid.ny);
    src[5 * grid.nx + 5] = G / (grid.h * grid.h);
    const { field } = solveSteady(op, src, 1e-11);
    const expected = G / (ach * 4 * 3);
    let lo = Infinity,
      hi = -Infinity;
    for (const value of field) {
      lo = Math.min(lo, value);
      hi = Math.max(hi, value);
    }
    expect(lo / expected).toBeGreaterThan(0.97);
    expect(hi / expected).toBeLessThan(1.03);
  });

  it("at steady state the source equals the removal, with drift and solid bodies (mass balance)", () => {
    // Conservation of the finite-volume scheme (Patankar, Numerical Heat Transfer and Fluid Flow, 1980, ch. 5): sum S = sum (lambda + extraction) C.
    const grid = createGrid(12, 8, 0.2);
    fillRect(grid, grid.solid, { x0: 4, y0: 1, x1: 5, y1: 6 }, 1);
    fillRect(grid, grid.solid, { x0: 8, y0: 2, x1: 8.2, y1: 8 }, 1);
    const q = terminalFlows(grid, [
      { x: 1, y: 1, radius: 0.6, sign: 1 },
      { x: 11, y: 6, radius: 0.6, sign: -1 },
    ]);
    const drift = potentialDrift(grid, q, 0.05);
    const diff = uniform(grid, 0.03);
    const op = buildOperator(grid, diff, 3 / 3600, drift);
    const src = new Float64Array(grid.nx * grid.ny);
    src[20 * grid.nx + 15] = 1 / (grid.h * grid.h);
    const { field } = solveSteady(op, src, 1e-12);
    let removed = 0;
    for (let k = 0; k < field.length; k++) if (!grid.solid[k]) removed += op.removal[k] * field[k] * grid.h * grid.h;
    expect(removed).toBeCloseTo(1, 6);
    for (const value of field) expect(value).toBeGreaterThanOrEqual(0);
  });

  it("the drift has no velocity through solid faces and no divergence away from terminals", () => {
    // Discrete potential flow with Neumann walls (Ferziger & Peric, Computational Methods for Fluid Dynamics: discrete continuity).
    const grid = createGrid(10, 6, 0.2);
    fillRect(grid, grid.solid, { x0: 3, y0: 0, x1: 3.2, y1: 4 }, 1);
    const q = terminalFlows(grid, [
      { x: 1, y: 1, radius: 0.5, sign: 1 },
      { x: 9, y: 1, radius: 0.5, sign: -1 },
    ]);
    const { u, v } = potentialDrift(grid, q, 0.05);
    const { nx, ny, solid } = grid;
    for (let j = 0; j < ny; j++) {
      for (let i = 0; i < nx; i++) {
        const k = j * nx + i;
        const out = u[j * (nx + 1) + i + 1] - u[j * (nx + 1) + i] + v[(j + 1) * nx + i] - v[j * nx + i];
        if (solid[k]) {
          expect(Math.abs(u[j * (nx + 1) + i]) + Math.abs(u[j * (nx + 1) + i + 1])).toBe(0);
          expect(Math.abs(v[j * nx + i]) + Math.abs(v[(j + 1) * nx + i])).toBe(0);
        } else if (q[k] === 0) {
          expect(Math.abs(out)).toBeLessThan(1e-6);
        }
      }
    }
  });

  it("no gas passes a wall without a gap, and some passes through a door gap", () => {
    // No-flux boundary: the far side of a closed partition stays exactly clean (Patankar 1980: zero conductance at a solid face).
    const closed = createGrid(8, 4, 0.2);
    fillRect(closed, closed.solid, { x0: 4, y0: 0, x1: 4.2, y1: 4 }, 1);
    const open = createGrid(8, 4, 0.2);
    fillRect(open, open.solid, { x0: 4, y0: 0, x1: 4.2, y1: 3 }, 1);
    const far = (grid: Grid) => {
      const op = buildOperator(grid, uniform(grid, 0.05), 2 / 3600);
      const src = new Float64Array(grid.nx * grid.ny);
      src[10 * grid.nx + 5] = 25;
      return solveSteady(op, src, 1e-11).field[10 * grid.nx + 35];
    };
    expect(far(closed)).toBe(0);
    expect(far(open)).toBeGreaterThan(1e-3);
  });

  it("along a ventilated channel a line source decays as the steady advection-dispersion-decay solution", () => {
    // c ~ exp(U x (1 -/+ a) / (2E)), a = sqrt(1 + 4 k E / U^2): the steady estuary with first-order decay
    // (Chapra, Surface Water-Quality Modeling, 1997, distributed systems at steady state).
    const grid = createGrid(30, 0.5, 0.05);
    const q = terminalFlows(grid, [
      { x: 0.3, y: 0.25, radius: 0.3, sign: 1 },
      { x: 29.7, y: 0.25, radius: 0.3, sign: -1 },
    ]);
    const drift = potentialDrift(grid, q, 0.05, 1e-10);
    const K = 0.02,
      k = 0.02;
    const op = buildOperator(grid, uniform(grid, K), k, drift);
    const src = new Float64Array(grid.nx * grid.ny);
    const at = (x: number) => Math.round(x / grid.h);
    for (let j = 0; j < grid.ny; j++) src[j * grid.nx + at(12)] = 1;
    const { field } = solveSteady(op, src, 1e-11);
    const U = drift.u[5 * (grid.nx + 1) + at(12)];
    const a = Math.sqrt(1 + (4 * k * K) / (U * U));
    const down = (U * (a - 1)) / (2 * K),
      up = (U * (a + 1)) / (2 * K);
    const c = (x: number) => field[5 * grid.nx + at(x)];
    expect(Math.log(c(13) / c(17)) / 4).toBeCloseTo(down, 2);
    expect(Math.abs(Math.log(c(11.8) / c(11.2)) / 0.6 / up - 1)).toBeLessThan(0.05);
  });
});
