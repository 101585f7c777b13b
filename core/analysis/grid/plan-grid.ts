import { polygonBounds } from "../geometry/bounds";
import { pointInVertices, vertexArrays, type VertexArrays } from "../geometry/point-in-polygon";
import type { Polygon } from "../geometry/types";

/**
 * A row-major raster of the plan: cell (i, j) has its centre at ((i + ½)h, (j + ½)h) and index j·width + i.
 * `blocked` marks solid bodies, through which neither air nor the technician passes.
 */
export interface PlanGrid {
  width: number;
  height: number;
  cellSize: number;
  blocked: Uint8Array;
}

// 3 x 3 sub-samples per cell: a 0.2 m partition on a 0.25 m grid always blocks a full row of cells,
// so diagonal moves cannot slip through it (see the corner rule in geodesic-distance.ts).
const SUB = [1 / 6, 1 / 2, 5 / 6];

export function createPlanGrid(
  planWidth: number,
  planHeight: number,
  cellSize: number,
  solids: readonly Polygon[],
): PlanGrid {
  if (!(cellSize > 0) || !Number.isFinite(cellSize))
    throw new Error(`cellSize must be a positive number, got ${cellSize}`);
  if (!(planWidth > 0) || !(planHeight > 0))
    throw new Error(`plan size must be positive, got ${planWidth} x ${planHeight}`);
  const width = Math.ceil(planWidth / cellSize - 1e-9);
  const height = Math.ceil(planHeight / cellSize - 1e-9);
  const blocked = new Uint8Array(width * height);
  for (const poly of solids) rasterise(poly, { width, height, cellSize, blocked });
  return { width, height, cellSize, blocked };
}

function rasterise(poly: Polygon, grid: PlanGrid): void {
  const { width, height, cellSize: h, blocked } = grid;
  const b = polygonBounds(poly);
  const i0 = Math.max(0, Math.floor(b.minX / h));
  const i1 = Math.min(width - 1, Math.floor(b.maxX / h));
  const j0 = Math.max(0, Math.floor(b.minY / h));
  const j1 = Math.min(height - 1, Math.floor(b.maxY / h));
  const vertices = vertexArrays(poly);
  for (let j = j0; j <= j1; j++) {
    for (let i = i0; i <= i1; i++) {
      const k = j * width + i;
      if (!blocked[k] && anySubSampleInside(i, j, h, vertices)) blocked[k] = 1;
    }
  }
}

/** Whether any of cell (i, j)'s 3 x 3 sub-samples lies inside the polygon. */
function anySubSampleInside(i: number, j: number, h: number, vertices: VertexArrays): boolean {
  for (let a = 0; a < 3; a++) {
    for (let b = 0; b < 3; b++) if (pointInVertices((i + SUB[b]) * h, (j + SUB[a]) * h, vertices)) return true;
  }
  return false;
}

export function cellIndexOf(grid: PlanGrid, x: number, y: number): number {
  const i = Math.min(grid.width - 1, Math.max(0, Math.floor(x / grid.cellSize)));
  const j = Math.min(grid.height - 1, Math.max(0, Math.floor(y / grid.cellSize)));
  return j * grid.width + i;
}

export function cellCentre(grid: PlanGrid, k: number): [number, number] {
  const i = k % grid.width;
  const j = (k - i) / grid.width;
  return [(i + 0.5) * grid.cellSize, (j + 0.5) * grid.cellSize];
}

/** The free cell nearest to (x, y), searched in growing square rings; -1 when the whole grid is solid. */
export function nearestFreeCell(grid: PlanGrid, x: number, y: number): number {
  const k0 = cellIndexOf(grid, x, y);
  if (!grid.blocked[k0]) return k0;
  const i0 = k0 % grid.width;
  const j0 = (k0 - i0) / grid.width;
  const maxRing = Math.max(grid.width, grid.height);
  for (let r = 1; r <= maxRing; r++) {
    let best = -1;
    let bestD = Infinity;
    for (let j = j0 - r; j <= j0 + r; j++) {
      if (j < 0 || j >= grid.height) continue;
      for (let i = i0 - r; i <= i0 + r; i++) {
        if (i < 0 || i >= grid.width) continue;
        if (Math.max(Math.abs(i - i0), Math.abs(j - j0)) !== r) continue;
        const k = j * grid.width + i;
        if (grid.blocked[k]) continue;
        const [cx, cy] = cellCentre(grid, k);
        const d = (cx - x) ** 2 + (cy - y) ** 2;
        if (d < bestD) {
          bestD = d;
          best = k;
        }
      }
    }
    if (best >= 0) return best;
  }
  return -1;
}

/** Cells whose centre lies inside the polygon (used for benign-source zones and fixture volumes). */
export function cellsInside(grid: PlanGrid, poly: Polygon): number[] {
  const h = grid.cellSize;
  const b = polygonBounds(poly);
  const out: number[] = [];
  const i0 = Math.max(0, Math.floor(b.minX / h));
  const i1 = Math.min(grid.width - 1, Math.floor(b.maxX / h));
  const j0 = Math.max(0, Math.floor(b.minY / h));
  const j1 = Math.min(grid.height - 1, Math.floor(b.maxY / h));
  const vertices = vertexArrays(poly);
  for (let j = j0; j <= j1; j++) {
    for (let i = i0; i <= i1; i++) {
      if (pointInVertices((i + 0.5) * h, (j + 0.5) * h, vertices)) out.push(j * grid.width + i);
    }
  }
  return out;
}

/** True when the straight segment from a to b crosses a blocked cell (sampled every quarter cell). */
export function segmentBlocked(grid: PlanGrid, ax: number, ay: number, bx: number, by: number): boolean {
  const len = Math.hypot(bx - ax, by - ay);
  const steps = Math.max(1, Math.ceil(len / (grid.cellSize / 4)));
  for (let s = 0; s <= steps; s++) {
    const f = s / steps;
    if (grid.blocked[cellIndexOf(grid, ax + f * (bx - ax), ay + f * (by - ay))]) return true;
  }
  return false;
}
