// The simulation's own raster of a store: a finer, cell-centred grid (0.1–0.2 m) that is independent
// of whatever grid the locator uses, so the benchmark does not share its discretisation.

export interface Rect {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

export interface Grid {
  nx: number;
  ny: number;
  /** Cell size in metres; cell (i, j) covers [i*h, (i+1)*h) x [j*h, (j+1)*h). */
  h: number;
  /** 1 where a solid body or wall fills the cell (no air, no flux through its faces). */
  solid: Uint8Array;
}

export function createGrid(width: number, height: number, h: number): Grid {
  if (!(width > 0) || !(height > 0))
    throw new Error(`grid: width and height must be positive, got ${width} x ${height}`);
  if (!(h > 0) || h > Math.min(width, height))
    throw new Error(`grid: cell size must be positive and smaller than the plan, got ${h}`);
  const nx = Math.ceil(width / h - 1e-9);
  const ny = Math.ceil(height / h - 1e-9);
  return { nx, ny, h, solid: new Uint8Array(nx * ny) };
}

/**
 * The index range of cells a rectangle claims. Rounding the edges (rather than testing cell centres)
 * keeps a 0.15 m wall at least one cell thick, so thin walls never leak through between cells.
 */
export function rectCells(grid: Grid, r: Rect): { i0: number; i1: number; j0: number; j1: number } {
  const { nx, ny, h } = grid;
  let i0 = Math.round(r.x0 / h),
    i1 = Math.round(r.x1 / h);
  let j0 = Math.round(r.y0 / h),
    j1 = Math.round(r.y1 / h);
  if (i1 <= i0) i1 = i0 + 1;
  if (j1 <= j0) j1 = j0 + 1;
  i0 = Math.max(0, Math.min(nx, i0));
  i1 = Math.max(0, Math.min(nx, i1));
  j0 = Math.max(0, Math.min(ny, j0));
  j1 = Math.max(0, Math.min(ny, j1));
  return { i0, i1, j0, j1 };
}

export function fillRect(grid: Grid, target: Uint8Array | Float64Array, r: Rect, value: number): void {
  const { i0, i1, j0, j1 } = rectCells(grid, r);
  for (let j = j0; j < j1; j++) for (let i = i0; i < i1; i++) target[j * grid.nx + i] = value;
}

export function cellOf(grid: Grid, x: number, y: number): number {
  const i = Math.max(0, Math.min(grid.nx - 1, Math.floor(x / grid.h)));
  const j = Math.max(0, Math.min(grid.ny - 1, Math.floor(y / grid.h)));
  return j * grid.nx + i;
}

/**
 * Bilinear interpolation between cell centres that skips solid cells (their value is not air), so a
 * probe held against a wall reads the air beside it, not an average with the wall's zero.
 */
export function sampleField(grid: Grid, field: Float64Array, x: number, y: number): number {
  const { nx, ny, h, solid } = grid;
  const fx = x / h - 0.5,
    fy = y / h - 0.5;
  const i = Math.floor(fx),
    j = Math.floor(fy);
  const tx = fx - i,
    ty = fy - j;
  let sum = 0,
    weight = 0;
  for (let dj = 0; dj <= 1; dj++) {
    for (let di = 0; di <= 1; di++) {
      const ci = i + di,
        cj = j + dj;
      if (ci < 0 || cj < 0 || ci >= nx || cj >= ny) continue;
      const k = cj * nx + ci;
      if (solid[k]) continue;
      const w = (di ? tx : 1 - tx) * (dj ? ty : 1 - ty);
      sum += w * field[k];
      weight += w;
    }
  }
  if (weight > 1e-9) return sum / weight;
  const k = cellOf(grid, x, y);
  return solid[k] ? 0 : field[k];
}
