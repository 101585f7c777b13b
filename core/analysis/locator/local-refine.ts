/**
 * Local refinement of a suspect spot: the mean of the fit's likelihood over the allowed cells around it
 * instead of its single best cell. The best cell of a flat or ridged Δχ² surface (a leak seen along a
 * case line) jumps between near-equal cells with the noise; the mean of exp(Δχ²/(2T)) over the
 * neighbourhood is steadier. T is the residual variance times an inflation factor, since raw χ² is far
 * too confident with correlated readings (docs/reference/locator-methods.md §5.6). With a prior (log odds per cell) the
 * mean is the posterior's: where the readings cannot tell cells apart (a fan-stirred walk-in reads level
 * all over) the prior decides, and where they can, the tempered likelihood does. The answer is snapped to the allowed
 * cell nearest the mean, so it never lands on a solid body or in a benign-source zone.
 */
export function refineCell(
  delta: Float64Array,
  allowed: Uint8Array,
  c: number,
  width: number,
  cellSize: number,
  radiusM: number,
  temperature: number,
  prior: Float64Array | null = null,
): number {
  if (!(radiusM > 0) || !(temperature > 0)) return c;
  const height = delta.length / width;
  const r = Math.ceil(radiusM / cellSize);
  const r2 = (radiusM / cellSize) ** 2;
  const ci = c % width;
  const cj = (c - ci) / width;
  let top = delta[c];
  const inWindow = (i: number, j: number) => (i - ci) ** 2 + (j - cj) ** 2 <= r2;
  const j0 = Math.max(0, cj - r),
    j1 = Math.min(height - 1, cj + r);
  const i0 = Math.max(0, ci - r),
    i1 = Math.min(width - 1, ci + r);
  for (let j = j0; j <= j1; j++)
    for (let i = i0; i <= i1; i++) {
      const k = j * width + i;
      if (inWindow(i, j) && allowed[k] && delta[k] > top) top = delta[k];
    }
  let sw = 0,
    si = 0,
    sj = 0;
  for (let j = j0; j <= j1; j++)
    for (let i = i0; i <= i1; i++) {
      const k = j * width + i;
      if (!inWindow(i, j) || !allowed[k] || !(delta[k] > 0)) continue;
      const wk = Math.exp((delta[k] - top) / (2 * temperature) + (prior ? prior[k] : 0));
      sw += wk;
      si += wk * i;
      sj += wk * j;
    }
  if (!(sw > 0)) return c;
  const mi = si / sw,
    mj = sj / sw;
  let best = c;
  let bestD = (ci - mi) ** 2 + (cj - mj) ** 2;
  for (let j = j0; j <= j1; j++)
    for (let i = i0; i <= i1; i++) {
      const k = j * width + i;
      if (!inWindow(i, j) || !allowed[k] || !(delta[k] > 0)) continue;
      const d = (i - mi) ** 2 + (j - mj) ** 2;
      if (d < bestD) {
        bestD = d;
        best = k;
      }
    }
  return best;
}
