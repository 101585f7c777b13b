import { GeodesicSearch } from "../grid/geodesic-distance";
import { nearestFreeCell, type PlanGrid } from "../grid/plan-grid";
import type { ResponseNodes } from "../lag/response-nodes";
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
   * Geodesic distance of each entry, and the position each group's search started from: with one
   * response node per reading they let a drifted kernel be evaluated again without new searches
   * (see local-drift.ts). Null with several nodes per reading.
   */
  dist: Float32Array | null;
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
}

export function accumulateReadingFields(
  grid: PlanGrid,
  nodes: ResponseNodes,
  values: Float64Array,
  weights: Float64Array,
  kernel: SourceKernel,
  mapSigmaM: number,
  stepScale: Float32Array | null = null,
): ReadingFields {
  const n = values.length;
  const m = nodes.weights.length;
  if (m === 0 || nodes.xs.length !== m || nodes.ys.length !== m)
    throw new Error("response nodes: need matching xs, ys and weights");
  const cells = grid.width * grid.height;
  // readings whose response nodes fall in the same cells share one combined column
  const nodeCells: Int32Array[] = nodes.xs.map((xs, k) =>
    Int32Array.from(xs, (x, i) => nearestFreeCell(grid, x, nodes.ys[k][i])),
  );
  const keyOf = (i: number) => {
    let key = "";
    for (let k = 0; k < m; k++) key += nodeCells[k][i] + ",";
    return key;
  };
  const groupOfReading = new Int32Array(n);
  const groupIndex = new Map<string, number>();
  const groupCellList: number[] = [];
  const groupW: number[] = [];
  const groupY: number[] = [];
  const groupCount: number[] = [];
  const groupFirst: number[] = [];
  for (let i = 0; i < n; i++) {
    const key = keyOf(i);
    let g = groupIndex.get(key);
    if (g === undefined) {
      g = groupCellList.length;
      groupIndex.set(key, g);
      groupCellList.push(nodeCells[0][i]);
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

  const sumWG = new Float64Array(cells);
  const sumWGG = new Float64Array(cells);
  const omega = new Float64Array(cells);
  const omegaY = new Float64Array(cells);
  const nearestReading = new Float32Array(cells).fill(Infinity);
  const start = new Int32Array(groups + 1);
  const perSearch = Math.ceil((Math.PI * kernel.truncationM ** 2) / grid.cellSize ** 2);
  let cap = Math.max(1024, groups * perSearch);
  let cellArr = new Int32Array(cap);
  let kernArr = new Float32Array(cap);
  let distArr = new Float32Array(m === 1 ? cap : 0);
  let used = 0;

  // per group: the response-weighted kernel and map weight of its nodes, gathered densely
  const combG = new Float64Array(cells);
  const combOm = new Float64Array(cells);
  const combD = new Float64Array(m === 1 ? cells : 0);
  const stamp = new Int32Array(cells).fill(-1);
  let touched: Int32Array = new Int32Array(4096);

  const search = new GeodesicSearch(grid, stepScale);
  const mapCut = 3 * mapSigmaM;
  const inv2s2 = 1 / (2 * mapSigmaM * mapSigmaM);
  for (let g = 0; g < groups; g++) {
    const i = groupFirst[g];
    let nTouched = 0;
    for (let k = 0; k < m; k++) {
      // identical node cells of one reading (standing still) are searched once with summed weight
      let dup = false;
      for (let k2 = 0; k2 < k; k2++) if (nodeCells[k2][i] === nodeCells[k][i]) dup = true;
      if (dup) continue;
      let a = 0;
      for (let k2 = k; k2 < m; k2++) if (nodeCells[k2][i] === nodeCells[k][i]) a += nodes.weights[k2];
      const settled = search.fromPoint(nodes.xs[k][i], nodes.ys[k][i], kernel.truncationM);
      const { dist } = search;
      const list = search.settled;
      for (let q = 0; q < settled; q++) {
        const c = list[q];
        const d = dist[c];
        if (d < nearestReading[c]) nearestReading[c] = d;
        if (stamp[c] !== g) {
          stamp[c] = g;
          combG[c] = 0;
          combOm[c] = 0;
          if (nTouched === touched.length) touched = growInt32(touched);
          touched[nTouched++] = c;
        }
        combG[c] += a * kernel.at(d);
        if (m === 1) combD[c] = d;
        if (d <= mapCut) combOm[c] += a * Math.exp(-d * d * inv2s2);
      }
    }
    if (used + nTouched > cap) {
      cap = Math.max(cap * 2, used + nTouched);
      const c2 = new Int32Array(cap);
      c2.set(cellArr.subarray(0, used));
      cellArr = c2;
      const k2 = new Float32Array(cap);
      k2.set(kernArr.subarray(0, used));
      kernArr = k2;
      if (m === 1) {
        const d2 = new Float32Array(cap);
        d2.set(distArr.subarray(0, used));
        distArr = d2;
      }
    }
    start[g] = used;
    const w = groupW[g];
    const ySum = groupY[g];
    const count = groupCount[g];
    for (let q = 0; q < nTouched; q++) {
      const c = touched[q];
      const gv = combG[c];
      if (gv > 0) {
        sumWG[c] += w * gv;
        sumWGG[c] += w * gv * gv;
        cellArr[used] = c;
        kernArr[used] = gv;
        if (m === 1) distArr[used] = combD[c];
        used++;
      }
      const om = combOm[c];
      if (om > 0) {
        omega[c] += count * om;
        omegaY[c] += ySum * om;
      }
    }
  }
  start[groups] = used;
  return {
    groupCell: Int32Array.from(groupCellList),
    groupOfReading,
    start,
    cell: cellArr.subarray(0, used),
    kernel: kernArr.subarray(0, used),
    dist: m === 1 ? distArr.subarray(0, used) : null,
    groupX: Float64Array.from(groupFirst, (i) => nodes.xs[0][i]),
    groupY: Float64Array.from(groupFirst, (i) => nodes.ys[0][i]),
    sumWG,
    sumWGG,
    omega,
    omegaY,
    nearestReading,
  };
}

function growInt32(a: Int32Array): Int32Array {
  const b = new Int32Array(a.length * 2);
  b.set(a);
  return b;
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
