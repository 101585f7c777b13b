// Steady advection–diffusion with first-order removal on the simulation grid, by finite volumes:
//   div(u C) - div(K grad C) + lambda C = S
// (the conservative form; Patankar, Numerical Heat Transfer and Fluid Flow, 1980, ch. 5), with
// harmonic-mean face diffusivities, the hybrid central/upwind scheme for advection (Spalding 1972;
// Patankar 1980, ch. 5: central where the cell Peclet number is at most 2, so the aisles' small eddy
// diffusivity is not swamped by numerical diffusion) and zero flux through every face that touches a
// solid cell or the plan's edge. The matrix is an M-matrix with diagonal surplus lambda, so the
// solution is positive and unique; it is solved by BiCGSTAB preconditioned with a relaxed modified ILU (van der Vorst 1992).
import type { Grid } from "./grid";
import { incompleteLu } from "./precondition";

export interface FaceVelocities {
  /** x-velocity (m/s) on vertical faces: u[j*(nx+1)+i] is the face between cells i-1 and i of row j. */
  u: Float64Array;
  /** y-velocity (m/s, +y down) on horizontal faces: v[j*nx+i] is the face between rows j-1 and j. */
  v: Float64Array;
}

export interface TransportOperator {
  grid: Grid;
  diag: Float64Array;
  west: Float64Array;
  east: Float64Array;
  north: Float64Array;
  south: Float64Array;
  /** Per-cell removal rate (1/s): air exchange plus extraction where the drift's return air leaves. */
  removal: Float64Array;
}

export function zeroVelocities(grid: Grid): FaceVelocities {
  return { u: new Float64Array((grid.nx + 1) * grid.ny), v: new Float64Array(grid.nx * (grid.ny + 1)) };
}

export function buildOperator(
  grid: Grid,
  diffusivity: Float64Array,
  exchangeRate: number,
  drift: FaceVelocities = zeroVelocities(grid),
): TransportOperator {
  const { nx, ny, h, solid } = grid;
  const n = nx * ny;
  if (diffusivity.length !== n)
    throw new Error(`transport: diffusivity has ${diffusivity.length} cells, grid has ${n}`);
  if (!(exchangeRate > 0)) throw new Error(`transport: exchange rate must be positive (1/s), got ${exchangeRate}`);
  if (drift.u.length !== (nx + 1) * ny || drift.v.length !== nx * (ny + 1))
    throw new Error("transport: drift face arrays do not match the grid");
  const diag = new Float64Array(n),
    west = new Float64Array(n),
    east = new Float64Array(n);
  const north = new Float64Array(n),
    south = new Float64Array(n),
    removal = new Float64Array(n);
  const outflow = new Float64Array(n); // net outward face velocity sum / h, i.e. the discrete divergence
  const h2 = h * h;
  const face = (a: number, b: number, w: number, toB: Float64Array, toA: Float64Array) => {
    // Face between cell a (upstream when w > 0) and cell b; w is the velocity from a towards b.
    if (solid[a] || solid[b]) return;
    const ka = diffusivity[a],
      kb = diffusivity[b];
    const kf = ka + kb > 0 ? (2 * ka * kb) / (ka + kb) : 0;
    const d = kf / h2;
    const f = w / h;
    if (Math.abs(f) <= 2 * d) {
      // Cell Peclet number <= 2: central differences, no numerical diffusion, coefficients stay >= 0.
      diag[a] += d + f / 2;
      diag[b] += d - f / 2;
      toA[a] += d - f / 2; // a's coefficient on b
      toB[b] += d + f / 2; // b's coefficient on a
    } else if (f > 0) {
      // Advection-dominated face: pure upwind with the diffusion dropped (Patankar's hybrid scheme).
      diag[a] += f;
      toB[b] += f;
    } else {
      diag[b] += -f;
      toA[a] += -f;
    }
    outflow[a] += w / h;
    outflow[b] -= w / h;
  };
  for (let j = 0; j < ny; j++) {
    for (let i = 1; i < nx; i++) face(j * nx + i - 1, j * nx + i, drift.u[j * (nx + 1) + i], west, east);
  }
  for (let j = 1; j < ny; j++) {
    for (let i = 0; i < nx; i++) face((j - 1) * nx + i, j * nx + i, drift.v[j * nx + i], north, south);
  }
  for (let k = 0; k < n; k++) {
    if (solid[k]) {
      diag[k] = 1;
      continue;
    }
    // The upwind terms already carry the conservative advection. Where more air arrives than leaves
    // (a return grille) the surplus leaves the floor carrying C; where more leaves than arrives (a supply
    // diffuser) the new air is clean, which the upwind outflow already accounts for.
    removal[k] = exchangeRate + Math.max(0, -outflow[k]);
    diag[k] += removal[k];
  }
  return { grid, diag, west, east, north, south, removal };
}

export function applyOperator(op: TransportOperator, x: Float64Array, out: Float64Array): void {
  const { nx, ny } = op.grid;
  const { diag, west, east, north, south } = op;
  for (let j = 0; j < ny; j++) {
    const row = j * nx;
    for (let i = 0; i < nx; i++) {
      const k = row + i;
      let s = diag[k] * x[k];
      if (i > 0) s -= west[k] * x[k - 1];
      if (i < nx - 1) s -= east[k] * x[k + 1];
      if (j > 0) s -= north[k] * x[k - nx];
      if (j < ny - 1) s -= south[k] * x[k + nx];
      out[k] = s;
    }
  }
}

export interface SolveResult {
  field: Float64Array;
  iterations: number;
  relativeResidual: number;
}

/** Solves op * C = source (source in concentration units per second, per cell). */
export function solveSteady(
  op: TransportOperator,
  source: Float64Array,
  tolerance = 1e-9,
  maxIterations = 20000,
): SolveResult {
  const n = op.diag.length;
  if (source.length !== n) throw new Error(`transport: source has ${source.length} cells, grid has ${n}`);
  const m = incompleteLu({ nx: op.grid.nx, ny: op.grid.ny, ...op });
  const x = new Float64Array(n),
    r = new Float64Array(n),
    rHat = new Float64Array(n);
  const p = new Float64Array(n),
    v = new Float64Array(n),
    s = new Float64Array(n),
    t = new Float64Array(n);
  const pHat = new Float64Array(n),
    sHat = new Float64Array(n);
  const dot = (a: Float64Array, b: Float64Array) => {
    let acc = 0;
    for (let k = 0; k < n; k++) acc += a[k] * b[k];
    return acc;
  };
  const bNorm = Math.sqrt(dot(source, source));
  if (bNorm === 0) return { field: x, iterations: 0, relativeResidual: 0 };
  let rho = 1,
    alpha = 1,
    omega = 1,
    restarts = 0;
  // BiCGSTAB can break down (rHat nearly orthogonal to the residual); restart from the current x.
  const restart = () => {
    if (++restarts > 50) throw new Error("transport: BiCGSTAB kept breaking down");
    applyOperator(op, x, r);
    for (let k = 0; k < n; k++) r[k] = source[k] - r[k];
    rHat.set(r);
    p.fill(0);
    v.fill(0);
    rho = alpha = omega = 1;
  };
  r.set(source);
  rHat.set(source);
  for (let it = 1; it <= maxIterations; it++) {
    const rhoNew = dot(rHat, r);
    const beta = (rhoNew / rho) * (alpha / omega);
    if (!Number.isFinite(beta) || rhoNew === 0) {
      restart();
      continue;
    }
    rho = rhoNew;
    for (let k = 0; k < n; k++) p[k] = r[k] + beta * (p[k] - omega * v[k]);
    m.apply(p, pHat);
    applyOperator(op, pHat, v);
    alpha = rho / dot(rHat, v);
    if (!Number.isFinite(alpha)) {
      restart();
      continue;
    }
    for (let k = 0; k < n; k++) s[k] = r[k] - alpha * v[k];
    const sRel = Math.sqrt(dot(s, s)) / bNorm;
    if (sRel < tolerance) {
      for (let k = 0; k < n; k++) x[k] += alpha * pHat[k];
      return { field: x, iterations: it, relativeResidual: sRel };
    }
    m.apply(s, sHat);
    applyOperator(op, sHat, t);
    const tt = dot(t, t);
    omega = tt > 0 ? dot(t, s) / tt : 0;
    if (!Number.isFinite(omega) || omega === 0) {
      for (let k = 0; k < n; k++) x[k] += alpha * pHat[k];
      restart();
      continue;
    }
    for (let k = 0; k < n; k++) {
      x[k] += alpha * pHat[k] + omega * sHat[k];
      r[k] = s[k] - omega * t[k];
    }
    const rel = Math.sqrt(dot(r, r)) / bNorm;
    if (rel < tolerance) return { field: x, iterations: it, relativeResidual: rel };
  }
  throw new Error(`transport: no convergence in ${maxIterations} iterations`);
}
