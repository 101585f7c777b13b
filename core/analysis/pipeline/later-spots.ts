import type { SuspectSpotFacts } from "../../contracts/locator-output";

/**
 * The first spot of the plain fit, then the spots of a second fit (the case-unit kernel, decision 0157)
 * taking turns with the plain fit's own later spots (`plain`, whose first is `first`), each kept when it
 * lies at least `separationM` from every spot already listed, up to `max` in all. The turns keep the
 * plain fit's second spot near the top: where the first spot is wrong (a wrong stated delay) it is often
 * the leak. Ranks follow the list; a score is never
 * higher than the one above it; strengths are relative to the first spot again (both fits use the same
 * kernel area, so their emissions compare).
 */
export function withLaterSpots(
  first: SuspectSpotFacts,
  later: readonly SuspectSpotFacts[],
  separationM: number,
  max: number,
  plain: readonly SuspectSpotFacts[] = [],
): SuspectSpotFacts[] {
  const out: SuspectSpotFacts[] = [first];
  const merged: SuspectSpotFacts[] = [];
  for (let i = 0; i < Math.max(later.length, plain.length); i++) {
    if (later[i]) merged.push(later[i]);
    if (plain[i + 1]) merged.push(plain[i + 1]);
  }
  for (const s of merged) {
    if (out.length >= max) break;
    if (out.some((o) => Math.hypot(s.x - o.x, s.y - o.y) < separationM)) continue;
    const above = out[out.length - 1];
    out.push({
      ...s,
      rank: out.length + 1,
      score: Math.min(s.score, above.score),
      strength: first.molPerYear > 0 ? Math.round((s.molPerYear / first.molPerYear) * 100) / 100 : s.strength,
    });
  }
  return out;
}
