import { quantileSorted, medianAbsoluteDeviation } from "simple-statistics";

/**
 * The ambient level: the lower quartile of the exact (not over-range) readings that benign-source
 * zones do not explain. A low quantile rather than the mean, because readings near a leak are a
 * minority that would pull a mean up (docs/reference/locator-methods.md §1b). Scale: the median absolute deviation.
 */
export function estimateBackground(values: Float64Array, usable: Uint8Array): { ppm: number; spread: number } {
  const xs: number[] = [];
  for (let i = 0; i < values.length; i++) if (usable[i]) xs.push(values[i]);
  if (xs.length === 0) for (let i = 0; i < values.length; i++) xs.push(values[i]);
  xs.sort((a, b) => a - b);
  return { ppm: quantileSorted(xs, 0.25), spread: xs.length > 1 ? medianAbsoluteDeviation(xs) : 0 };
}
