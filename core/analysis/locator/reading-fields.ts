import { borrowSearch, giveBackSearch, type SearchFocus } from "../grid/geodesic-distance";
import { nearestFreeCell, type PlanGrid } from "../grid/plan-grid";
import type { SourceKernel } from "./source-kernel";

/**
 * One truncated geodesic search per sampled cell (readings in the same cell share it), accumulating
 * everything later steps need, so no reading-by-cell distance matrix is ever held (docs/reference/locator-methods.md §2,
 * route 1). By the symmetry of distance, the kernel value of a reading seen from a cell equals the
 * cell seen from the reading, so the per-cell source fit needs no per-candidate search.
 */
export interface ReadingFields {
  /** Sampled cell of each group, and the group of each reading. */
  groupCell: Int32Array;
  groupOfReading: Int32Array;
  /** CSR by group: entries[start[g] .. start[g+1]) hold (cell, kernel value). */
  start: Int32Array;
  cell: Int32Array;
  kernel: Float32Array;
  /**
   * Geodesic distance of each entry, and the position each group's search started from: they let a
   * drifted kernel be evaluated again without new searches (see local-drift.ts).
   */
  dist: Float32Array;
  groupX: Float64Array;
  groupY: Float64Array;
  /** Per cell Σ w·g and Σ w·g² over readings (weights w as given). */
  sumWG: Float64Array;
  sumWGG: Float64Array;
  /** Per cell Gaussian map weights Ω = Σ ω and Σ ω·y (Kernel DM+V, Lilienthal et al. 2009). */
  omega: Float64Array;
  omegaY: Float64Array;
  /** Geodesic distance from each cell to the nearest reading (Infinity beyond the truncation radius). */
  nearestReading: Float32Array;
  /** Cells [from, to) hold every finite nearest reading, when the field was focused on a circle (its rows); null: any cell may. */
  reach: { readonly from: number; readonly to: number } | null;
}

export function accumulateReadingFields(
  grid: PlanGrid,
  xs: Float64Array,
  ys: Float64Array,
  values: Float64Array,
  weights: Float64Array,
  kernel: SourceKernel,
  mapSigmaM: number,
  stepScale: Float32Array | null = null,
  /**
   * Only the groups holding a reading marked here are searched (the others keep no entries, as if no
   * cell were within reach): a partial field, exact for the cells every unsearched reading is out of
   * reach of. Null searches every group. A partial field draws no map: its Ω sums stay 0 (the map
   * comes from a full field; a retry screen only fits sources).
   */
  searched: Uint8Array | null = null,
  /**
   * Only the cells of this circle are wanted (a retry screen's region): the searches do not step on
   * from cells that cannot reach it, and cells outside it get no entries, sums or nearest reading
   * (Infinity, as out of every reading's reach), so the later steps work on the circle alone.
   */
  focus: SearchFocus | null = null,
): ReadingFields {
  const n = values.length;
  if (xs.length !== n || ys.length !== n) throw new Error("reading fields: need one position per reading");
  const cells = grid.width * grid.height;
  // readings in the same cell share one search
  const groupOfReading = new Int32Array(n);
  const groupIndex = new Map<number, number>();
  const groupCellList: number[] = [];
  const groupW: number[] = [];
  const groupY: number[] = [];
  const groupCount: number[] = [];
  const groupFirst: number[] = [];
  for (let i = 0; i < n; i++) {
    const cell = nearestFreeCell(grid, xs[i], ys[i]);
    let g = groupIndex.get(cell);
    if (g === undefined) {
      g = groupCellList.length;
      groupIndex.set(cell, g);
      groupCellList.push(cell);
      groupW.push(0);
      groupY.push(0);
      groupCount.push(0);
      groupFirst.push(i);
    }
    groupW[g] += weights[i];
    groupY[g] += values[i];
    groupCount[g]++;
    groupOfReading[i] = g;
  }
  const groups = groupCellList.length;
  let groupSearched: Uint8Array | null = null;
  if (searched) {
    groupSearched = new Uint8Array(groups);
    for (let i = 0; i < n; i++) if (searched[i]) groupSearched[groupOfReading[i]] = 1;
  }

  const sumWG = new Float64Array(cells);
  const sumWGG = new Float64Array(cells);
  const omega = new Float64Array(cells);
  const omegaY = new Float64Array(cells);
  const nearestReading = new Float32Array(cells).fill(Infinity);
  const start = new Int32Array(groups + 1);
  const perSearch = Math.ceil((Math.PI * kernel.truncationM ** 2) / grid.cellSize ** 2);
  const entries = new EntryList(
    Math.max(1024, (groupSearched ? groupSearched.reduce((a, b) => a + b, 0) : groups) * perSearch),
  );
  const wanted = focus ? cellsInFocus(grid, focus) : null;
  const search = borrowSearch(grid, stepScale);
  const mapCut = searched ? -1 : 3 * mapSigmaM;
  const inv2s2 = 1 / (2 * mapSigmaM * mapSigmaM);
  // each search's loops are small functions of their own, so the JIT optimises them on their own
  // rather than in the middle of this loop (docs/decisions/0147)
  for (let g = 0; g < groups; g++) {
    start[g] = entries.used;
    if (groupSearched && !groupSearched[g]) continue;
    const i = groupFirst[g];
    const settled = search.reach(xs[i], ys[i], kernel.truncationM, focus);
    entries.reserve(settled);
    addKernelEntries(
      entries,
      search.settled,
      settled,
      search.dist,
      wanted,
      kernel,
      groupW[g],
      sumWG,
      sumWGG,
      nearestReading,
    );
    if (mapCut >= 0)
      addMapWeights(
        search.settled,
        settled,
        search.dist,
        wanted,
        groupCount[g],
        groupY[g],
        mapCut,
        inv2s2,
        omega,
        omegaY,
      );
  }
  const used = entries.used;
  start[groups] = used;
  giveBackSearch(search);
  return {
    groupCell: Int32Array.from(groupCellList),
    groupOfReading,
    start,
    cell: entries.cell.subarray(0, used),
    kernel: entries.kernel.subarray(0, used),
    dist: entries.dist.subarray(0, used),
    groupX: Float64Array.from(groupFirst, (i) => xs[i]),
    groupY: Float64Array.from(groupFirst, (i) => ys[i]),
    sumWG,
    sumWGG,
    omega,
    omegaY,
    nearestReading,
    reach: focus ? rowsOf(grid, focus) : null,
  };
}

/** The cells of the rows the focus circle's cells lie on (cellsInFocus's rows). */
function rowsOf(grid: PlanGrid, focus: SearchFocus): { from: number; to: number } {
  const h = grid.cellSize;
  const j0 = Math.max(0, Math.floor((focus.y - focus.radiusM) / h));
  const j1 = Math.min(grid.height - 1, Math.floor((focus.y + focus.radiusM) / h));
  return j1 < j0 ? { from: 0, to: 0 } : { from: j0 * grid.width, to: (j1 + 1) * grid.width };
}

/** The (cell, kernel value, distance) entries of the searches so far, grown as needed. */
class EntryList {
  cell: Int32Array;
  kernel: Float32Array;
  dist: Float32Array;
  used = 0;
  constructor(capacity: number) {
    this.cell = new Int32Array(capacity);
    this.kernel = new Float32Array(capacity);
    this.dist = new Float32Array(capacity);
  }
  /** Room for `extra` more entries. */
  reserve(extra: number): void {
    if (this.used + extra <= this.cell.length) return;
    const cap = Math.max(this.cell.length * 2, this.used + extra);
    const cell = new Int32Array(cap);
    cell.set(this.cell.subarray(0, this.used));
    this.cell = cell;
    const kernel = new Float32Array(cap);
    kernel.set(this.kernel.subarray(0, this.used));
    this.kernel = kernel;
    const dist = new Float32Array(cap);
    dist.set(this.dist.subarray(0, this.used));
    this.dist = dist;
  }
}

/** One search's cells within the kernel's reach: their entries, Σ w·g and Σ w·g², and the nearest reading. */
function addKernelEntries(
  entries: EntryList,
  list: Int32Array,
  settled: number,
  dist: Float64Array,
  wanted: Uint8Array | null,
  kernel: SourceKernel,
  w: number,
  sumWG: Float64Array,
  sumWGG: Float64Array,
  nearestReading: Float32Array,
): void {
  const { cell, dist: entryDist } = entries;
  const values = entries.kernel;
  let used = entries.used;
  for (let q = 0; q < settled; q++) {
    const c = list[q];
    if (wanted !== null && wanted[c] === 0) continue;
    const d = dist[c];
    if (d < nearestReading[c]) nearestReading[c] = d;
    const gv = kernel.at(d);
    if (gv > 0) {
      sumWG[c] += w * gv;
      sumWGG[c] += w * gv * gv;
      cell[used] = c;
      values[used] = gv;
      entryDist[used] = d;
      used++;
    }
  }
  entries.used = used;
}

/** One search's Gaussian map weights Ω and Ω·y for the cells within `mapCut` (Kernel DM+V). */
function addMapWeights(
  list: Int32Array,
  settled: number,
  dist: Float64Array,
  wanted: Uint8Array | null,
  count: number,
  ySum: number,
  mapCut: number,
  inv2s2: number,
  omega: Float64Array,
  omegaY: Float64Array,
): void {
  for (let q = 0; q < settled; q++) {
    const c = list[q];
    if (wanted !== null && wanted[c] === 0) continue;
    const d = dist[c];
    if (d <= mapCut) {
      const om = Math.exp(-d * d * inv2s2);
      if (om > 0) {
        omega[c] += count * om;
        omegaY[c] += ySum * om;
      }
    }
  }
}

/** 1 for the cells whose centre lies within the focus circle (the region a retry screen reads). */
function cellsInFocus(grid: PlanGrid, focus: SearchFocus): Uint8Array {
  const out = new Uint8Array(grid.width * grid.height);
  const h = grid.cellSize;
  const { x, y, radiusM } = focus;
  const r2 = radiusM * radiusM;
  const i0 = Math.max(0, Math.floor((x - radiusM) / h));
  const i1 = Math.min(grid.width - 1, Math.floor((x + radiusM) / h));
  const j0 = Math.max(0, Math.floor((y - radiusM) / h));
  const j1 = Math.min(grid.height - 1, Math.floor((y + radiusM) / h));
  for (let j = j0; j <= j1; j++) {
    for (let i = i0; i <= i1; i++)
      if (((i + 0.5) * h - x) ** 2 + ((j + 0.5) * h - y) ** 2 <= r2) out[j * grid.width + i] = 1;
  }
  return out;
}

/** Per cell Σ_i w_i·g_i(c)·r_i for a per-reading vector r (one pass over the stored entries). */
export function sumWeightedKernelTimes(
  fields: ReadingFields,
  weights: Float64Array,
  r: Float64Array,
  out: Float64Array,
): Float64Array {
  out.fill(0);
  const groups = fields.groupCell.length;
  const perGroup = new Float64Array(groups);
  for (let i = 0; i < r.length; i++) perGroup[fields.groupOfReading[i]] += weights[i] * r[i];
  const { start, cell, kernel } = fields;
  for (let g = 0; g < groups; g++) {
    const a = perGroup[g];
    if (a === 0) continue;
    for (let e = start[g], end = start[g + 1]; e < end; e++) out[cell[e]] += a * kernel[e];
  }
  return out;
}

/** Kernel values g_i(c) of every reading for one source cell c (0 beyond the truncation radius). */
export function kernelColumn(fields: ReadingFields, c: number, readings: number): Float64Array {
  const groups = fields.groupCell.length;
  const perGroup = new Float64Array(groups);
  const { start, cell, kernel } = fields;
  for (let g = 0; g < groups; g++) {
    for (let e = start[g], end = start[g + 1]; e < end; e++) {
      if (cell[e] === c) {
        perGroup[g] = kernel[e];
        break;
      }
    }
  }
  const out = new Float64Array(readings);
  for (let i = 0; i < readings; i++) out[i] = perGroup[fields.groupOfReading[i]];
  return out;
}
