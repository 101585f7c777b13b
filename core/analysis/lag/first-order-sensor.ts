// The sensor's first-order response τ·ẏ + y = u (docs/reference/locator-methods.md §1a), for irregularly spaced samples.
// Pure; the locator corrects positions by the response's mean delay τ (see lag-correct.ts) rather than
// deconvolving, because the exact inverse amplifies noise by 1/(1 − e^(−Δt/τ)).

/** Step response of a first-order system: 1 − e^(−t/τ). */
export function firstOrderStep(t: number, timeConstantS: number): number {
  if (t <= 0) return 0;
  if (timeConstantS === 0) return 1;
  return 1 - Math.exp(-t / timeConstantS);
}

/**
 * Exact discrete response to an input held constant between samples (zero-order hold):
 * y_k = α_k·y_(k−1) + (1 − α_k)·u_(k−1), α_k = e^(−Δt_k/τ), starting from y_0 = u_0.
 */
export function filterFirstOrder(times: readonly number[], input: readonly number[], timeConstantS: number): number[] {
  const out = new Array<number>(input.length);
  if (input.length === 0) return out;
  out[0] = input[0];
  for (let k = 1; k < input.length; k++) {
    const a = timeConstantS > 0 ? Math.exp(-(times[k] - times[k - 1]) / timeConstantS) : 0;
    out[k] = a * out[k - 1] + (1 - a) * input[k - 1];
  }
  return out;
}

/** The exact inverse of filterFirstOrder: u_(k−1) = (y_k − α_k·y_(k−1))/(1 − α_k) (docs/reference/locator-methods.md §1a.2). */
export function unfilterFirstOrder(
  times: readonly number[],
  output: readonly number[],
  timeConstantS: number,
): number[] {
  const u = new Array<number>(output.length);
  for (let k = 1; k < output.length; k++) {
    const a = timeConstantS > 0 ? Math.exp(-(times[k] - times[k - 1]) / timeConstantS) : 0;
    u[k - 1] = (output[k] - a * output[k - 1]) / (1 - a);
  }
  if (output.length > 0) u[output.length - 1] = NaN; // the last input is not yet visible in the output
  return u;
}
