import type { SuspectSpotFacts } from "../../contracts/locator-output";

/**
 * The first spot of the plain fit, then the spots of a second fit (the case-unit kernel, decision 0157)
 * that lie at least `separationM` from it, up to `max` in all. Ranks follow the list; a score is never
 * higher than the one above it; strengths are relative to the first spot again (both fits use the same
 * kernel area, so their emissions compare).
 */
export function withLaterSpots(
  first: SuspectSpotFacts,
  later: readonly SuspectSpotFacts[],
  separationM: number,
  max: number,
): SuspectSpotFacts[] {
  const out: SuspectSpotFacts[] = [first];
  for (const s of later) {
    if (out.length >= max) break;
    if (Math.hypot(s.x - first.x, s.y - first.y) < separationM) continue;
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
