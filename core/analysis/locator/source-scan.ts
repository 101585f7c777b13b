/**
 * Every cell as a candidate source: the weighted least-squares fit of r_i ≈ b + Q·g_i(c) with Q ≥ 0,
 * b ≥ 0 in closed form from per-cell sums (docs/reference/locator-methods.md §1d), and the χ² improvement over the
 * background-only model, Δχ²(c) = χ²₀ − χ²(c).
 */
export interface ScanTotals {
  sumW: number;
  sumWR: number;
  sumWRR: number;
}

/** The scan's totals over the readings: Σw, Σw·r and Σw·r² of the residual `r`. */
export function scanTotals(w: Float64Array, r: Float64Array): ScanTotals {
  let sumW = 0,
    sumWR = 0,
    sumWRR = 0;
  for (let i = 0; i < r.length; i++) {
    sumW += w[i];
    sumWR += w[i] * r[i];
    sumWRR += w[i] * r[i] * r[i];
  }
  return { sumW, sumWR, sumWRR };
}

export interface ScanResult {
  delta: Float64Array;
  q: Float64Array;
  b: Float64Array;
  chi2Background: number;
  /** Every Δχ² outside cells [from, to) is 0 (absent: any cell may hold one). */
  from?: number;
  to?: number;
}

export function scanSources(
  sumWG: Float64Array,
  sumWGG: Float64Array,
  sumWGR: Float64Array,
  totals: ScanTotals,
  /** 1 for a cell that may hold a source, else 0. */
  allowed: Uint8Array,
): ScanResult {
  const n = sumWG.length;
  const delta = new Float64Array(n);
  const q = new Float64Array(n);
  const b = new Float64Array(n);
  const chi0 = backgroundChi2(totals);
  // only the allowed cells' span is visited: a retry screen allows the cells of a small circle only
  const from = Math.max(0, allowed.indexOf(1));
  const to = allowed.lastIndexOf(1) + 1;
  for (let c = from; c < to; c++) {
    if (!allowed[c]) continue;
    const d = fitOneCell(sumWG[c], sumWGG[c], sumWGR[c], totals, chi0);
    if (d > 0) {
      delta[c] = d;
      q[c] = cellFit.q;
      b[c] = cellFit.b;
    }
  }
  return { delta, q, b, chi2Background: chi0, from, to };
}

/** χ² of the background-only model b₀ = max(0, Σwr/Σw). */
export function backgroundChi2(totals: ScanTotals): number {
  const { sumW: sw, sumWR: swr, sumWRR: swrr } = totals;
  const b0 = Math.max(0, swr / sw);
  return swrr - 2 * b0 * swr + b0 * b0 * sw;
}

/** Q and b of the last fitOneCell that found a source (one object, so the per-cell loops allocate nothing). */
const cellFit = { q: 0, b: 0 };

/**
 * The fit at one cell from its sums: Δχ² over the background-only model (chi0), 0 when no source with
 * Q > 0 fits; Q and b are left in `cellFit`. Shared by the scan and the drift choice (local-drift.ts) so
 * both compute every cell the same way.
 */
export function fitOneCell(swg: number, swgg: number, swgr: number, totals: ScanTotals, chi0: number): number {
  if (swgg <= 0) return 0;
  const { sumW: sw, sumWR: swr, sumWRR: swrr } = totals;
  const det = sw * swgg - swg * swg;
  let qc = det > 1e-12 * sw * swgg ? (sw * swgr - swg * swr) / det : swgr / swgg;
  let bc = (swr - qc * swg) / sw;
  if (bc < 0) {
    bc = 0;
    qc = swgr / swgg;
  }
  if (!(qc > 0)) return 0;
  const chi = swrr - 2 * bc * swr - 2 * qc * swgr + bc * bc * sw + 2 * bc * qc * swg + qc * qc * swgg;
  const d = chi0 - chi;
  if (!(d > 0)) return 0;
  cellFit.q = qc;
  cellFit.b = bc;
  return d;
}

/**
 * Local optima of a score map with non-maximum suppression: cells taken best first, each at least
 * `separationM` from every cell already taken. At most `limit` cells.
 */
export function localOptima(
  score: Float64Array,
  gridWidth: number,
  cellSize: number,
  separationM: number,
  limit: number,
  minScore = 0,
): number[] {
  const idx: number[] = [];
  for (let c = 0; c < score.length; c++) if (score[c] > minScore) idx.push(c);
  idx.sort((a, b) => score[b] - score[a]);
  const out: number[] = [];
  const sep2 = (separationM / cellSize) ** 2;
  for (const c of idx) {
    const ci = c % gridWidth;
    const cj = (c - ci) / gridWidth;
    let ok = true;
    for (const o of out) {
      const oi = o % gridWidth;
      const oj = (o - oi) / gridWidth;
      if ((ci - oi) ** 2 + (cj - oj) ** 2 < sep2) {
        ok = false;
        break;
      }
    }
    if (ok) {
      out.push(c);
      if (out.length >= limit) break;
    }
  }
  return out;
}
