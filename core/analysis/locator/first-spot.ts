import { explainedPeak, type FoundSource } from "./greedy-sources";

/**
 * In still air, the first spot is the fitted source (among the first `among` of the list) whose share
 * explains the highest reading, and the others keep their order after it. The drift carries a still-air
 * plume along the lineup for several metres; the greedy fit often puts its strongest source (by `q`, the
 * excess extrapolated to the kernel's cut-off) on that trail, downwind, and the source at the leak comes
 * second or third with the plume's own peak (docs/locator/benchmark-baseline.md, "Eighth round, first suspect").
 * Alternatives and spots from one reading are never moved up.
 */
export function firstByExplainedPeak(found: readonly FoundSource[], among: number): readonly FoundSource[] {
  const fitted = found.filter((f) => !f.alternate && !f.oneReading).slice(0, among);
  if (fitted.length < 2) return found;
  const best = fitted.reduce((a, b) => (explainedPeak(b) > explainedPeak(a) ? b : a));
  return best === found[0] ? found : [best, ...found.filter((f) => f !== best)];
}
