import type { LocatorInput } from "../../contracts/locator-input";
import type { SuspectSpotFacts } from "../../contracts/locator-output";
import { cellIndexOf, type PlanGrid } from "../grid/plan-grid";
import { caseUnitStepScale } from "../locator/case-unit-scale";
import { casesRunFans, fanRoomsScale } from "../locator/plan-masks";
import type { LocatorSettings } from "../locator/settings";

/**
 * The list of spots where most display cases run their fans (decision 0157): the plain fit's first,
 * then turns between its later spots and those of a second run whose field reads each case as one
 * mixed unit (`rerun` with that step scale). Null, and the plain list stands, with pinpoint passes
 * (their air the joint fit models), without a first spot, for a one-reading spot, or when the first
 * spot lies in a fan-stirred room: its room's next fitting follows it there as its alternative
 * (placement-stage.ts). A mirror across a one-sided pass gives way to the later spots; the first
 * spot's own next checks still say to walk the other face.
 */
export function laterSpotsStage(args: {
  plan: LocatorInput["plan"];
  grid: PlanGrid;
  stepScale: Float32Array | null;
  settings: LocatorSettings;
  plain: readonly SuspectSpotFacts[];
  passes: boolean;
  oneReading: boolean;
  rerun: (fieldScale: Float32Array) => readonly SuspectSpotFacts[];
}): SuspectSpotFacts[] | null {
  const { plan, grid, settings, plain } = args;
  const caseScale = settings.placement.laterSpotsCaseScale;
  const first = plain[0];
  if (!(caseScale > 0) || args.passes || !first || args.oneReading || !casesRunFans(plan.fixtures)) return null;
  const rooms = fanRoomsScale(grid, plan, 0.5);
  if (rooms !== null && rooms[cellIndexOf(grid, first.x, first.y)] < 1) return null;
  const unitScale = caseUnitStepScale(grid, plan, args.stepScale, caseScale);
  if (!unitScale) return null;
  const s = settings.sources;
  return withLaterSpots(first, args.rerun(unitScale), s.separationM, s.maxCandidates, plain);
}

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
