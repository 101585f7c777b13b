/**
 * The radius around a spot that holds `share` of the tempered posterior of the leak's position: weights
 * exp(Δχ²/(2T) + prior) over the allowed cells within `reachM`, added up outward from the spot. Where the
 * readings pin the spot down the weight sits close to it and the radius is small; along a case line
 * they cannot tell apart, or where a prior pulls elsewhere, it spreads and the radius grows. Raw Δχ² is
 * far too confident with correlated readings (docs/reference/locator-methods.md §5.6), hence the
 * tempering T, and the caller scales the result to a calibrated coverage (docs/locator/method.md).
 */
export function posteriorRadius(
  delta: Float64Array,
  allowed: Uint8Array,
  c: number,
  width: number,
  cellSize: number,
  reachM: number,
  temperature: number,
  prior: Float64Array | null,
  share: number,
): number {
  if (!(temperature > 0) || !(share > 0)) return 0;
  const height = delta.length / width;
  const r = Math.ceil(reachM / cellSize);
  const ci = c % width;
  const cj = (c - ci) / width;
  const dist: number[] = [];
  const logW: number[] = [];
  let top = -Infinity;
  for (let j = Math.max(0, cj - r); j <= Math.min(height - 1, cj + r); j++)
    for (let i = Math.max(0, ci - r); i <= Math.min(width - 1, ci + r); i++) {
      const k = j * width + i;
      const d = Math.hypot(i - ci, j - cj) * cellSize;
      if (d > reachM || !allowed[k] || !(delta[k] > 0)) continue;
      const lw = delta[k] / (2 * temperature) + (prior ? prior[k] : 0);
      if (lw > top) top = lw;
      dist.push(d);
      logW.push(lw);
    }
  if (dist.length === 0) return 0;
  const w = logW.map((lw) => Math.exp(lw - top));
  const total = w.reduce((a, b) => a + b, 0);
  const order = dist.map((_, k) => k).sort((a, b) => dist[a] - dist[b]);
  let held = 0;
  for (const k of order) {
    held += w[k];
    if (held >= share * total) return dist[k];
  }
  return dist[order[order.length - 1]];
}
