import { lagCorrect, type LagOptions, type LaggedPosition, type Tap } from "./lag-correct";

/**
 * The sensor's first-order response as a forward model (docs/reference/locator-methods.md §1a step 2, "filter the
 * predicted u along the path inside the fit"). A probe with hose delay D and time constant τ reads
 * y(t) = ∫₀^∞ (1/τ)·e^(−s/τ)·u(t − D − s) ds, so the reading predicted from a source is a weighted sum
 * of the kernel at a few earlier points of the walk. The integral against e^(−x) is taken by
 * Gauss–Laguerre quadrature (Abramowitz & Stegun 25.4.45, table 25.9): exact for u a polynomial of
 * degree 2n − 1 in time, and still linear in the source strength, so the per-cell closed-form fit stays.
 */
export interface ResponseNodes {
  /** Node m of reading i lies at (xs[m][i], ys[m][i]) with weight weights[m] (the weights sum to 1). */
  xs: Float64Array[];
  ys: Float64Array[];
  weights: number[];
}

// Abramowitz & Stegun table 25.9: abscissae and weights of ∫₀^∞ e^(−x) f(x) dx ≈ Σ w f(x).
const GAUSS_LAGUERRE: Record<number, { x: number[]; w: number[] }> = {
  1: { x: [1], w: [1] }, // the mean delay alone: the plain shift by D + τ
  2: { x: [0.585786437627, 3.414213562373], w: [0.853553390593, 0.146446609407] },
  3: { x: [0.415774556783, 2.294280360279, 6.289945082937], w: [0.711093009929, 0.278517733569, 0.010389256502] },
};

export function gaussLaguerre(count: number): { x: number[]; w: number[] } {
  const rule = GAUSS_LAGUERRE[count];
  if (!rule) throw new Error(`response nodes: ${count} is not one of ${Object.keys(GAUSS_LAGUERRE).join(", ")}`);
  return rule;
}

export function responseNodes(
  taps: readonly Tap[],
  delayS: number,
  timeConstantS: number,
  count: number,
  options: LagOptions = {},
): ResponseNodes {
  const rule = gaussLaguerre(timeConstantS > 0 ? count : 1);
  const xs: Float64Array[] = [];
  const ys: Float64Array[] = [];
  rule.x.forEach((x) => {
    const at: LaggedPosition[] = lagCorrect(taps, delayS + x * timeConstantS, 0, options);
    xs.push(Float64Array.from(at, (p) => p.x));
    ys.push(Float64Array.from(at, (p) => p.y));
  });
  return { xs, ys, weights: rule.w.slice() };
}
