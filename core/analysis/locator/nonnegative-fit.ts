/**
 * Weighted least squares y ≈ b + Σ_k Q_k·g_k with b ≥ 0 and Q_k ≥ 0, by cyclic coordinate descent
 * (exact minimisation per coordinate, then projection on ≥ 0; converges for this convex problem).
 * Sizes are small (a background and a few sources), so this is simpler than an active-set NNLS.
 * Censored readings (`atLeast`) count only while the prediction falls short of them.
 */
export interface NonnegativeFit {
  b: number;
  q: number[];
  chi2: number;
}

export function fitNonnegative(
  y: Float64Array,
  w: Float64Array,
  columns: readonly Float64Array[],
  censored: Uint8Array,
  iterations = 200,
): NonnegativeFit {
  const n = y.length;
  const k = columns.length;
  const q = new Array<number>(k).fill(0);
  let b = 0;
  const pred = new Float64Array(n);
  const active = (i: number) => !censored[i] || pred[i] < y[i];
  for (let it = 0; it < iterations; it++) {
    let change = 0;
    // background
    {
      let num = 0;
      let den = 0;
      for (let i = 0; i < n; i++) {
        if (!active(i)) continue;
        num += w[i] * (y[i] - (pred[i] - b));
        den += w[i];
      }
      const nb = den > 0 ? Math.max(0, num / den) : 0;
      if (nb !== b) {
        for (let i = 0; i < n; i++) pred[i] += nb - b;
        change = Math.max(change, Math.abs(nb - b));
        b = nb;
      }
    }
    for (let s = 0; s < k; s++) {
      const g = columns[s];
      let num = 0;
      let den = 0;
      for (let i = 0; i < n; i++) {
        if (g[i] === 0 || !active(i)) continue;
        num += w[i] * g[i] * (y[i] - (pred[i] - q[s] * g[i]));
        den += w[i] * g[i] * g[i];
      }
      const nq = den > 0 ? Math.max(0, num / den) : 0;
      if (nq !== q[s]) {
        for (let i = 0; i < n; i++) pred[i] += (nq - q[s]) * g[i];
        change = Math.max(change, Math.abs(nq - q[s]) / (1 + Math.abs(nq)));
        q[s] = nq;
      }
    }
    if (change < 1e-7) break;
  }
  let chi2 = 0;
  for (let i = 0; i < n; i++) if (active(i)) chi2 += w[i] * (y[i] - pred[i]) ** 2;
  return { b, q, chi2 };
}
