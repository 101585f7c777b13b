import type { CorrectedReading, SuspectSpotFacts } from "../../contracts/locator-output";
import type { ProbePlace } from "./probe-places";

/** One place the leak could be, with how much the readings so far favour it (weights sum to 1). */
export interface Hypothesis {
  x: number;
  y: number;
  weight: number;
  /** Excess ppm at the kernel's near-field cut-off, fitted to the readings. */
  amplitude: number;
  /** The suspect spot it belongs to (its rank), so a reason can name what a reading tells apart. */
  rank: number;
  fixtureId: string | null;
  /** The kernel g at displacement (dx, dy) from the site when a drift carries its gas (evidence-search.ts); else the plain kernel. */
  shape?: (dx: number, dy: number) => number;
  /** That drift, a = u/(2K) (1/m), pointing downwind. */
  drift?: readonly [number, number];
}

/** Why a probe place was chosen, as facts; the words are the presenter's. */
export type ProbeReason =
  | { kind: "separates"; ranks: [number, number]; fixtureIds: [string | null, string | null] }
  | { kind: "narrows"; rank: number; fixtureId: string | null }
  /** Before any credible spot: finds where along this fixture the alarm's gas is strongest (evidence-search.ts). */
  | { kind: "traces"; fixtureId: string | null };

export interface ProbeSuggestion extends ProbePlace {
  /** Expected information from a reading here (a sum of pairwise separations; larger tells more). */
  value: number;
  reason: ProbeReason;
}

/** The kernel g(d), 0..1, the locator fits spots with (locator/source-kernel.ts). */
export type Kernel = (d: number) => number;

/**
 * The hypotheses of the current suspect spots: each spot's centre and four points on half its radius
 * (where else inside its circle the leak may be), weighted by the spot's score, each with the
 * amplitude that best fits the corrected readings by least squares.
 */
export function hypothesesOf(
  candidates: readonly Pick<SuspectSpotFacts, "rank" | "x" | "y" | "radius" | "score" | "fixtureId">[],
  readings: readonly CorrectedReading[],
  kernel: Kernel,
  top = 3,
) {
  const hs: Hypothesis[] = [];
  const spots = candidates.slice(0, top);
  const total = spots.reduce((s, c) => s + Math.max(c.score, 1e-3), 0);
  for (const c of spots) {
    const r = c.radius / 2;
    const points: [number, number][] = [
      [c.x, c.y],
      [c.x + r, c.y],
      [c.x - r, c.y],
      [c.x, c.y + r],
      [c.x, c.y - r],
    ];
    for (const [x, y] of points) {
      let num = 0;
      let den = 0;
      for (const reading of readings) {
        const g = kernel(Math.hypot(reading.corrected.x - x, reading.corrected.y - y));
        num += g * reading.ppm;
        den += g * g;
      }
      const share = Math.max(c.score, 1e-3) / total / points.length;
      hs.push({ x, y, weight: share, amplitude: den > 0 ? num / den : 0, rank: c.rank, fixtureId: c.fixtureId });
    }
  }
  return hs;
}

/**
 * Spread of one reading about the value a hypothesis predicts: the sampled air fluctuates by about
 * 30 % (a log-normal multiplier, docs/locator/method.md) and a display that shows whole ppm, with its
 * own noise and the background's wander, adds about 1 ppm (from memory).
 */
const readingVariance = (ppm: number) => (0.3 * ppm) ** 2 + 1;

/**
 * Up to `n` probe places where one more reading best tells the hypotheses apart: for each place, the
 * weighted sum over pairs of hypotheses of (difference of the predicted readings)² / (sum of their
 * variances), the expected log-likelihood ratio of a Gaussian reading between the two (Kullback and
 * Leibler 1951, for equal-variance normals; an information-gain design criterion). Places closer than
 * `minSpacingM` to a chosen one are skipped; the chosen ones are ordered for the shortest walk from `from`.
 */
export function nextProbes(
  hypotheses: readonly Hypothesis[],
  places: readonly ProbePlace[],
  kernel: Kernel,
  from: { x: number; y: number },
  n = 3,
  minSpacingM = 0.6,
): ProbeSuggestion[] {
  const scored = places.map((p) => {
    const predicted = hypotheses.map(
      (h) => h.amplitude * (h.shape ? h.shape(p.x - h.x, p.y - h.y) : kernel(Math.hypot(p.x - h.x, p.y - h.y))),
    );
    let value = 0;
    let best = { v: -1, i: 0, j: 0 };
    for (let i = 0; i < hypotheses.length; i++) {
      for (let j = i + 1; j < hypotheses.length; j++) {
        const d = predicted[i] - predicted[j];
        const v =
          (hypotheses[i].weight * hypotheses[j].weight * d * d) /
          (readingVariance(predicted[i]) + readingVariance(predicted[j]));
        value += v;
        if (v > best.v) best = { v, i, j };
      }
    }
    const a = hypotheses[best.i];
    const b = hypotheses[best.j];
    const reason: ProbeReason =
      a && b && a.rank !== b.rank
        ? { kind: "separates", ranks: [a.rank, b.rank], fixtureIds: [a.fixtureId, b.fixtureId] }
        : { kind: "narrows", rank: a?.rank ?? 1, fixtureId: a?.fixtureId ?? null };
    return { ...p, value, reason };
  });
  scored.sort((p, q) => q.value - p.value);
  const chosen: ProbeSuggestion[] = [];
  for (const s of scored) {
    if (chosen.length >= n || s.value <= 0) break;
    if (chosen.some((c) => Math.hypot(c.x - s.x, c.y - s.y) < minSpacingM && c.kind === s.kind)) continue;
    chosen.push(s);
  }
  return shortestWalk(chosen, from);
}

/** The order of a few points that makes the shortest walk from `from` (all orders tried: n ≤ 3). */
function shortestWalk<T extends { x: number; y: number }>(points: T[], from: { x: number; y: number }): T[] {
  let best = points;
  let bestLength = Number.POSITIVE_INFINITY;
  for (const order of permutations(points)) {
    let at = from;
    let length = 0;
    for (const p of order) {
      length += Math.hypot(p.x - at.x, p.y - at.y);
      at = p;
    }
    if (length < bestLength) [best, bestLength] = [order, length];
  }
  return best;
}

function permutations<T>(items: T[]): T[][] {
  if (items.length <= 1) return [items];
  return items.flatMap((item, k) =>
    permutations([...items.slice(0, k), ...items.slice(k + 1)]).map((rest) => [item, ...rest]),
  );
}
