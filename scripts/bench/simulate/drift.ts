// A weak room drift that never crosses a solid body: potential flow u = -grad(phi) from supply
// diffusers to return grilles, with zero normal velocity on every solid face (a Neumann problem,
// lap(phi) = -q), solved on the simulation grid by preconditioned conjugate gradients (Hestenes & Stiefel 1952).
// Discretely it is exactly divergence-free away from the diffusers and grilles, so the transport
// solver's conservative upwind scheme neither creates nor loses gas in the aisles.
import type { Grid } from "./grid";
import type { FaceVelocities } from "./transport";
import { incompleteLu, type FivePoint } from "./precondition";

export interface AirTerminal {
  x: number;
  y: number;
  radius: number;
  /** +1 supply (air enters the floor), -1 return (air leaves). */
  sign: 1 | -1;
}

/** The graph Laplacian of the open cells as a 5-point operator (unit conductance per open face). */
function neumannLaplacian(grid: Grid): FivePoint {
  const { nx, ny, solid } = grid;
  const n = nx * ny;
  const a: FivePoint = {
    nx,
    ny,
    diag: new Float64Array(n),
    west: new Float64Array(n),
    east: new Float64Array(n),
    north: new Float64Array(n),
    south: new Float64Array(n),
  };
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      if (solid[k]) {
        a.diag[k] = 1; // decoupled; its right-hand side is zero so it stays at zero
        continue;
      }
      if (i > 0 && !solid[k - 1]) a.west[k] = 1;
      if (i < nx - 1 && !solid[k + 1]) a.east[k] = 1;
      if (j > 0 && !solid[k - nx]) a.north[k] = 1;
      if (j < ny - 1 && !solid[k + nx]) a.south[k] = 1;
      a.diag[k] = a.west[k] + a.east[k] + a.north[k] + a.south[k];
    }
  }
  return a;
}

function apply(a: FivePoint, x: Float64Array, out: Float64Array): void {
  const { nx, ny, diag, west, east, north, south } = a;
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      let s = diag[k] * x[k];
      if (i > 0) s -= west[k] * x[k - 1];
      if (i < nx - 1) s -= east[k] * x[k + 1];
      if (j > 0) s -= north[k] * x[k - nx];
      if (j < ny - 1) s -= south[k] * x[k + nx];
      out[k] = s;
    }
  }
}

/**
 * Net outflow per cell (m^2/s per metre of depth) from the terminals, balanced so supply equals return;
 * terminals that land on solid cells are skipped. Throws when nothing usable remains.
 */
export function terminalFlows(grid: Grid, terminals: readonly AirTerminal[]): Float64Array {
  const { nx, ny, h, solid } = grid;
  const q = new Float64Array(nx * ny);
  const cells: number[][] = terminals.map((t) => {
    const out: number[] = [];
    const r = Math.ceil(t.radius / h);
    const ci = Math.floor(t.x / h),
      cj = Math.floor(t.y / h);
    for (let j = cj - r; j <= cj + r; j++) {
      for (let i = ci - r; i <= ci + r; i++) {
        if (i < 0 || j < 0 || i >= nx || j >= ny || solid[j * nx + i]) continue;
        if (Math.hypot((i + 0.5) * h - t.x, (j + 0.5) * h - t.y) <= t.radius) out.push(j * nx + i);
      }
    }
    return out;
  });
  const supplyCells = cells.filter((c, k) => terminals[k].sign > 0 && c.length > 0);
  const returnCells = cells.filter((c, k) => terminals[k].sign < 0 && c.length > 0);
  if (supplyCells.length === 0 || returnCells.length === 0)
    throw new Error("drift: need at least one supply and one return on open floor");
  const spread = (groups: number[][], total: number) => {
    for (const g of groups) for (const k of g) q[k] += total / groups.length / g.length;
  };
  spread(supplyCells, 1);
  spread(returnCells, -1);
  return q;
}

/** Face velocities of the potential flow, scaled so the median cell speed over open air is `medianSpeed`. */
export function potentialDrift(grid: Grid, q: Float64Array, medianSpeed: number, tolerance = 1e-7): FaceVelocities {
  const { nx, ny, h, solid } = grid;
  const n = nx * ny;
  if (!(medianSpeed >= 0)) throw new Error(`drift: median speed must be >= 0 m/s, got ${medianSpeed}`);
  const a = neumannLaplacian(grid);
  // Preconditioned CG on the singular but consistent Neumann system (the flows sum to zero); the
  // incomplete factor is symmetric for a symmetric matrix, as CG needs.
  const m = incompleteLu(a, 0.9);
  const phi = new Float64Array(n),
    r = Float64Array.from(q),
    z = new Float64Array(n),
    p = new Float64Array(n),
    ap = new Float64Array(n);
  m.apply(r, z);
  p.set(z);
  let rz = 0,
    rr0 = 0;
  for (let k = 0; k < n; k++) {
    rz += r[k] * z[k];
    rr0 += r[k] * r[k];
  }
  for (let it = 0; it < 20000; it++) {
    apply(a, p, ap);
    let pap = 0;
    for (let k = 0; k < n; k++) pap += p[k] * ap[k];
    if (pap <= 0) break;
    const alpha = rz / pap;
    let rr = 0;
    for (let k = 0; k < n; k++) {
      phi[k] += alpha * p[k];
      r[k] -= alpha * ap[k];
      rr += r[k] * r[k];
    }
    if (rr <= tolerance * tolerance * rr0) break;
    m.apply(r, z);
    let rzNew = 0;
    for (let k = 0; k < n; k++) rzNew += r[k] * z[k];
    const beta = rzNew / rz;
    rz = rzNew;
    for (let k = 0; k < n; k++) p[k] = z[k] + beta * p[k];
  }
  const u = new Float64Array((nx + 1) * ny),
    v = new Float64Array(nx * (ny + 1));
  // Outflow from cell a to b through one face is (phi_a - phi_b) in m^2/s per metre; divide by h for m/s.
  for (let j = 0; j < ny; j++) {
    for (let i = 1; i < nx; i++) {
      const a = j * nx + i - 1,
        b = a + 1;
      if (!solid[a] && !solid[b]) u[j * (nx + 1) + i] = (phi[a] - phi[b]) / h;
    }
  }
  for (let j = 1; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const a = (j - 1) * nx + i,
        b = j * nx + i;
      if (!solid[a] && !solid[b]) v[j * nx + i] = (phi[a] - phi[b]) / h;
    }
  }
  const speeds: number[] = [];
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      if (solid[j * nx + i]) continue;
      const cu = 0.5 * (u[j * (nx + 1) + i] + u[j * (nx + 1) + i + 1]);
      const cv = 0.5 * (v[j * nx + i] + v[(j + 1) * nx + i]);
      speeds.push(Math.hypot(cu, cv));
    }
  }
  speeds.sort((a, b) => a - b);
  const median = speeds.length ? speeds[Math.floor(speeds.length / 2)] : 0;
  const scale = median > 0 ? medianSpeed / median : 0;
  for (let k = 0; k < u.length; k++) u[k] *= scale;
  for (let k = 0; k < v.length; k++) v[k] *= scale;
  return { u, v };
}
