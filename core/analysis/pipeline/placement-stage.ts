import type { LocatorInput } from "../../contracts/locator-input";
import type { SuspectSpotFacts } from "../../contracts/locator-output";
import { cellCentre, cellIndexOf, cellsInside, type PlanGrid } from "../grid/plan-grid";
import { fittingAt } from "../locator/at-fitting";
import { allowedTowardFront, onCaseBack } from "../locator/case-back";
import { oneSidedPass } from "../locator/diagnostics";
import { firstByExplainedPeak } from "../locator/first-spot";
import type { FoundSource } from "../locator/greedy-sources";
import { refineCell } from "../locator/local-refine";
import { posteriorRadius } from "../locator/posterior-radius";
import { nearestFixture, nearestRiskPoint } from "../locator/nearest-features";
import { kernelColumn } from "../locator/reading-fields";
import type { KernelSettings, PlacementSettings, ReportSettings, SourceSettings } from "../locator/settings";
import { upwindReplace } from "../locator/upwind-replace";
import { kernelArea } from "../locator/source-kernel";
import { spotNextChecks, spotReason, type SpotGeometry } from "../locator/spot-facts";
import { HOURS_PER_YEAR, ppmToMgPerM3, wellMixedEmission } from "../locator/units";
import type { FieldResult } from "./field-stage";
import type { LagResult } from "./lag-stage";
import { cellDistance, round2 } from "./numbers";
import { outsideFanRooms, supportingReadings, type SourcesResult, type SupportRule } from "./sources-stage";

/** Stage 5: where each found source is listed, how sure the list is, and the facts behind each spot. */
export interface PlacementResult {
  readonly candidates: readonly SuspectSpotFacts[];
  /** The top spot is seen from one pass only (its side of the path is uncertain). */
  readonly topOneSided: boolean;
}

// Risk points of one fan-stirred room are listed as separate spots when at least this far apart: twice
// the 0.5 m reach of the risk-point prior, so two spots never name the same fitting.
const ROOM_RISK_SPACING_M = 1;

export function placementStage(
  plan: LocatorInput["plan"],
  grid: PlanGrid,
  lag: LagResult,
  field: FieldResult,
  sources: SourcesResult,
  rule: SupportRule,
  settings: {
    placement: PlacementSettings;
    sources: SourceSettings;
    report: ReportSettings;
    kernel: KernelSettings;
  },
  /** Fixed columns fitted with the sources: benign zones, then stilled fixtures' levels. */
  nuisance: readonly Float64Array[] = [],
): PlacementResult {
  const p = settings.placement;
  const s0 = settings.sources;
  const { xs, ys, ppm: y } = lag;
  const n = y.length;
  const cells = grid.width * grid.height;
  const { allowed, prior, fields, fit, firstScan } = sources;
  const s2 = sources.residualVariance;
  const support = (column: Float64Array, residual: Float64Array) => supportingReadings(rule, column, fit.b, residual);

  // In a walk-in or machine room whose fans run the readings are level all over the room, so where in
  // the room the leak is cannot be read from them: take the room's most probable cell (tempered fit plus
  // the risk-point prior), which is a coil, valve or line-set drop unless the readings say otherwise.
  const roomOf = new Int32Array(cells).fill(-1);
  plan.fixtures.forEach((f, r) => {
    if (f.fans && (f.kind === "walk-in" || f.kind === "machine-room"))
      for (const k of cellsInside(grid, f.polygon)) roomOf[k] = r;
  });
  const taken: number[] = [];
  const farFromTaken = (k: number, minM: number) =>
    taken.every((t) => cellDistance(t, k, grid.width) * grid.cellSize >= minM);
  const roomBest = (s: FoundSource, room: number, riskOnly = false): number => {
    const T = p.refineInflation * s2;
    let best = -1;
    let bestScore = -Infinity;
    for (const k of cellsInside(grid, plan.fixtures[room].polygon)) {
      if (
        !allowed[k] ||
        !(s.surface[k] > 0) ||
        !farFromTaken(k, riskOnly ? ROOM_RISK_SPACING_M : s0.separationM) ||
        (riskOnly && !(prior && prior[k] > 0))
      )
        continue;
      const score = s.surface[k] / (2 * T) + (prior ? prior[k] : 0);
      if (score > bestScore) {
        bestScore = score;
        best = k;
      }
    }
    return best;
  };

  // mirror of the top spot across a single pass, as an alternative (docs/reference/locator-methods.md §5.3)
  const withMirror = (found: readonly FoundSource[]): readonly FoundSource[] => {
    if (found.length === 0 || found.length >= s0.maxCandidates) return found;
    const top = found[0];
    const [x, y0] = cellCentre(grid, top.cell);
    const sup = support(top.column, y);
    const side = oneSidedPass(
      sup.map((i) => xs[i]),
      sup.map((i) => ys[i]),
      x,
      y0,
    );
    if (!side.oneSided) return found;
    const [mx, my] = side.mirror;
    if (mx < 0 || my < 0 || mx > plan.width || my > plan.height) return found;
    const mc = cellIndexOf(grid, mx, my);
    if (!allowed[mc] || found.some((f) => cellDistance(f.cell, mc, grid.width) * grid.cellSize < s0.separationM))
      return found;
    const mirror: FoundSource = {
      cell: mc,
      delta: firstScan.delta[mc],
      column: kernelColumn(fields, mc, n),
      alternate: true,
      q: firstScan.q[mc],
      surface: firstScan.delta,
    };
    return [top, mirror, ...found.slice(1)].slice(0, s0.maxCandidates);
  };

  // still air: the spot at the plume's own peak first, not the strongest source on its trail (first-spot.ts)
  let found =
    p.stillFirstByPeak && !field.fansStir ? firstByExplainedPeak(sources.found, s0.rankedRounds) : sources.found;
  if (
    p.upwindStrengths.length > 0 &&
    field.fansStir &&
    field.kernels.length === 1 &&
    found.length > 0 &&
    roomOf[found[0].cell] < 0
  ) {
    // a plume trailing along a fan-stirred lineup: its sharp upwind edge marks the leak (decision 0128). Not in
    // still air (its own drift fit), nor in a fan-stirred room (level all over), nor with a pinpoint pass (it pins the leak)
    const k = settings.kernel;
    found = upwindReplace(
      {
        fields: field.fields,
        y,
        w: field.weights,
        censored: lag.censored,
        nuisance,
        allowed: outsideFanRooms(allowed, grid, plan),
        prior,
        gridWidth: grid.width,
        cellSize: grid.cellSize,
        windowM: p.upwindWindowM,
        minMoveM: p.upwindMinMoveM,
        minGain: p.upwindMinGain,
        separationM: s0.sourceSeparationM,
        drift: {
          screeningLengthM: k.screeningLengthM,
          far: field.fansStir && k.farShare > 0 ? { lengthM: k.farScreeningLengthM, share: k.farShare } : null,
          nearCutoffM: k.nearCutoffM,
          truncationM: k.truncationM,
          strengths: p.upwindStrengths,
          penalty: p.upwindPenalty,
        },
      },
      found,
    );
  }
  const placed: FoundSource[] = [];
  // spots named at a point of their cell rather than its centre: at a fitting, on a case's back line
  const namedAt = new Map<FoundSource, readonly [number, number]>();
  const moveTo = (s: FoundSource, x: number, y0: number, cell = cellIndexOf(grid, x, y0)): FoundSource => {
    const out = cell === s.cell ? { ...s } : { ...s, cell, column: kernelColumn(fields, cell, n) };
    namedAt.set(out, [x, y0]);
    return out;
  };
  const allowedAt = (x: number, y0: number) => allowed[cellIndexOf(grid, x, y0)] === 1;
  const atFitting = (s: FoundSource): FoundSource => {
    const [x, y0] = cellCentre(grid, s.cell);
    const fitting = p.fittingReachM > 0 ? fittingAt(plan.riskPoints, x, y0, p.fittingReachM, allowedAt) : null;
    return fitting ? moveTo(s, fitting.x, fitting.y) : s;
  };
  // a case spot the prior did not place goes to the case's back, where its piping runs (case-back.ts)
  const atCaseBack = (s: FoundSource): FoundSource => {
    if (!p.toCaseBack || (prior && prior[s.cell] > 0)) return s;
    const centre = cellCentre(grid, s.cell);
    const back = onCaseBack(plan.fixtures, grid, ...centre);
    // named on the back line; its cell the nearest allowed one toward the front when a spine overlaps it
    const cell = back && allowedTowardFront(back, centre, grid.cellSize / 2, allowedAt);
    return back && cell ? moveTo(s, ...back, cellIndexOf(grid, ...cell)) : s;
  };
  for (const s of withMirror(found)) {
    const room = roomOf[s.cell];
    if (room < 0) {
      const cell = refineCell(
        s.surface,
        allowed,
        s.cell,
        grid.width,
        grid.cellSize,
        p.refineRadiusM,
        p.refineInflation * s2,
        prior,
      );
      const spot = atCaseBack(cell === s.cell ? s : { ...s, cell, column: kernelColumn(fields, cell, n) });
      placed.push(spot);
      taken.push(spot.cell);
      continue;
    }
    const best = roomBest(s, room);
    if (best < 0) continue; // every cell of the room is already listed
    const spot = atFitting(best === s.cell ? s : { ...s, cell: best, column: kernelColumn(fields, best, n) });
    placed.push(spot);
    taken.push(spot.cell);
    if (s.alternate) continue;
    // the room's next most probable risk point (else cell) follows a fitted spot placed in a fan-stirred room
    let next = roomBest(s, room, true);
    if (next < 0) next = roomBest(s, room);
    if (next >= 0) {
      const alternative = atFitting({
        cell: next,
        delta: s.surface[next],
        column: kernelColumn(fields, next, n),
        alternate: true,
        q: s.q,
        surface: s.surface,
      });
      placed.push(alternative);
      taken.push(alternative.cell);
    }
  }
  placed.splice(s0.maxCandidates);

  const r = settings.report;
  const topQ = Math.max(placed[0]?.q ?? 0, 1e-12);
  // moles per year: the room balance at a molar mass of 1 g/mol gives g/yr numerically equal to mol/yr
  const molPerYearPerQ =
    (wellMixedEmission(ppmToMgPerM3(1, 1), r.airChangesPerH, kernelArea(field.kernel) * r.mixingHeightM) *
      HOURS_PER_YEAR) /
    1000;
  const candidates: SuspectSpotFacts[] = [];
  let topOneSided = false;
  placed.forEach((s, rank) => {
    const [x, y0] = namedAt.get(s) ?? cellCentre(grid, s.cell);
    const sup = support(s.column, y);
    const side = oneSidedPass(
      sup.map((i) => xs[i]),
      sup.map((i) => ys[i]),
      x,
      y0,
    );
    if (rank === 0) topOneSided = side.oneSided;
    const posteriorR = Math.max(
      p.minRadiusM,
      p.radiusScale *
        posteriorRadius(
          s.surface,
          allowed,
          s.cell,
          grid.width,
          grid.cellSize,
          p.radiusReachM,
          p.radiusInflation * s2,
          prior,
          p.radiusShare,
        ),
    );
    // one reading's posterior is flat over all it can see: its radius is the reach of its air instead
    const radius = s.oneReading ? p.oneReadingRadiusM : posteriorR;
    const fixture = nearestFixture(plan.fixtures, x, y0);
    const riskPoint = nearestRiskPoint(plan.riskPoints, x, y0);
    const facts: SpotGeometry = {
      alternate: s.alternate,
      oneReading: s.oneReading === true,
      supportCount: sup.length,
      peakPpm: sup.reduce((m, i) => Math.max(m, y[i]), 0),
      backgroundPpm: field.background.ppm,
      fixture,
      riskPoint,
      oneSided: side.oneSided,
      radius,
    };
    const rawScore = 1 - Math.exp(-0.5 * Math.sqrt(s.delta / (s2 * s0.minDeltaChi2)));
    const score = Math.min(rawScore, rank > 0 ? candidates[rank - 1].score : 1);
    candidates.push({
      rank: rank + 1,
      x: round2(x),
      y: round2(y0),
      radius: round2(radius),
      score: round2(score),
      strength: round2(s.q / topQ),
      molPerYear: s.q * molPerYearPerQ,
      fixtureId: fixture?.item.id ?? null,
      riskPointId: riskPoint?.item.id ?? null,
      reason: spotReason(facts),
      nextChecks: spotNextChecks(facts),
    });
  });
  return { candidates, topOneSided };
}
