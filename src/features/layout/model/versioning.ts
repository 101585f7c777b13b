/**
 * Plan versions: a new drawing (or a re-calibration once sweeps exist) makes a new version;
 * its fixtures are carried over with the SAME ids, and the version stores its alignment to the
 * previous one, a similarity (offset, rotation, scale) fixed by two matched points, so sweeps
 * on different versions can be compared without moving any old sweep.
 */
import {
  applySimilarity,
  composeSimilarity,
  IDENTITY,
  invertSimilarity,
  similarityFromTwoPoints,
  type Similarity,
} from "#core/analysis/geometry/similarity";
import { BOUNDS_TOLERANCE_M, type Fixture, type PlanBounds } from "#core/contracts/fixtures";
import { planPoint, type PlanPoint } from "../../../lib/plan-view/coordinates";
import { fixtureVertices, mapFixture } from "./fixture-geometry";

/** Two landmarks (e.g. two building corners) as found on the previous and on the new version. */
export interface MatchedPoints {
  previous: readonly [PlanPoint, PlanPoint];
  next: readonly [PlanPoint, PlanPoint];
}

/**
 * The alignment previous → next from two matched points: it sends each previous landmark
 * exactly onto its match. Throws when the two landmarks of either version coincide.
 */
export function alignmentFromMatches(m: MatchedPoints): Similarity {
  const all = [...m.previous, ...m.next];
  if (!all.every((p) => Number.isFinite(p.x) && Number.isFinite(p.y)))
    throw new RangeError("matched points must be finite plan positions");
  const [a1, a2] = m.previous;
  const [b1, b2] = m.next;
  return similarityFromTwoPoints([a1.x, a1.y], [a2.x, a2.y], [b1.x, b1.y], [b2.x, b2.y]);
}

export function mapToNextVersion(p: PlanPoint, alignment: Similarity): PlanPoint {
  const [x, y] = applySimilarity(alignment, [p.x, p.y]);
  return planPoint(x, y);
}

export function mapToPreviousVersion(p: PlanPoint, alignment: Similarity): PlanPoint {
  return mapToNextVersion(p, invertSimilarity(alignment));
}

/**
 * Maps a position between any two versions of a plan. `alignments[i]` is the stored alignment
 * of version i + 1 to version i (so a plan with k versions has k − 1 of them); versions are
 * numbered from 0. Works forwards and backwards.
 */
export function mapBetweenVersions(
  p: PlanPoint,
  alignments: readonly Similarity[],
  from: number,
  to: number,
): PlanPoint {
  const last = alignments.length;
  for (const [name, v] of [
    ["from", from],
    ["to", to],
  ] as const) {
    if (!(Number.isInteger(v) && v >= 0 && v <= last))
      throw new RangeError(`${name} must be a version from 0 to ${last}, got ${v}`);
  }
  const lo = Math.min(from, to);
  const hi = Math.max(from, to);
  let t = IDENTITY;
  for (let i = lo; i < hi; i++) t = composeSimilarity(t, alignments[i]);
  return mapToNextVersion(p, from <= to ? t : invertSimilarity(t));
}

export interface CarriedFixtures {
  fixtures: Fixture[];
  /** Ids of carried fixtures that now reach outside the new plan: the lead tech must fix them before saving. */
  outside: string[];
}

/**
 * Copies fixtures onto the next version: same ids, labels, systems and properties, geometry
 * mapped by the alignment (door offsets and widths scaled with it).
 */
export function carryFixtures(fixtures: readonly Fixture[], alignment: Similarity, next: PlanBounds): CarriedFixtures {
  const carried = fixtures.map((f) => mapFixture(f, (p) => applySimilarity(alignment, p), alignment.scale));
  const t = BOUNDS_TOLERANCE_M;
  const outside = carried
    .filter((f) => fixtureVertices(f).some(([x, y]) => x < -t || y < -t || x > next.width + t || y > next.height + t))
    .map((f) => f.id);
  return { fixtures: carried, outside };
}
