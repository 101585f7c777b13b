import type { LocatorInput } from "../../contracts/locator-input";
import type { PlanGrid } from "../grid/plan-grid";
import { findSources, residualOf, type FoundSource } from "../locator/greedy-sources";
import { broadKernel, diffuseBump, pointOverBroad, type DiffuseBump } from "../locator/diffuse-bump";
import { chooseLocalDrift } from "../locator/local-drift";
import type { NonnegativeFit } from "../locator/nonnegative-fit";
import { driftTrials, equipmentMask, fanRoomsScale, fanStepScale, riskPointPrior } from "../locator/plan-masks";
import type { ReadingFields } from "../locator/reading-fields";
import type { KernelSettings, SourceSettings } from "../locator/settings";
import type { ScanResult } from "../locator/source-scan";
import type { FieldResult } from "./field-stage";
import type { LagResult } from "./lag-stage";
import type { ZonesResult } from "./zones-stage";

/** Stage 4: the leaks the readings support, fitted jointly with the benign-source zones. */
export interface SourcesResult {
  /** The reading fields the fit used (with each cell's drift in still air). */
  readonly fields: ReadingFields;
  /** Cells where a suspect spot may lie. */
  readonly allowed: Uint8Array;
  /** Log prior odds of a leak per cell, null when there are no risk points to weigh. */
  readonly prior: Float64Array | null;
  /** Fitted sources (strongest first), then alternatives of the first scan. */
  readonly found: readonly FoundSource[];
  /** The final joint fit: background b, then one strength per zone, per stilled fixture's level, then per fitted source. */
  readonly fit: NonnegativeFit;
  readonly firstScan: ScanResult;
  /** Residual variance of the final fit (at least 1), which tempers every Δχ² later on. */
  readonly residualVariance: number;
}

/** What decides which readings support a spot. */
export interface SupportRule {
  readonly threshold: number;
  readonly elevatedPpm: number;
  readonly zoneOfReading: Int32Array;
}

/** Readings near a spot (kernel at least `threshold`), outside active zones, at least `elevatedPpm` over b. */
export function supportingReadings(
  rule: SupportRule,
  column: Float64Array,
  b: number,
  residual: Float64Array,
): number[] {
  const idx: number[] = [];
  for (let i = 0; i < column.length; i++) {
    if (column[i] >= rule.threshold && rule.zoneOfReading[i] < 0 && residual[i] - b >= rule.elevatedPpm) idx.push(i);
  }
  return idx;
}

export function supportRule(
  field: Pick<FieldResult, "kernels">,
  zones: ZonesResult,
  sources: SourceSettings,
): SupportRule {
  return {
    // with several air models, a reading within the radius in any of them supports the spot
    threshold: Math.min(...field.kernels.map((k) => k.at(sources.supportRadiusM))),
    elevatedPpm: sources.elevatedPpm,
    zoneOfReading: zones.zoneOfReading,
  };
}

/**
 * The allowed cells (1, else 0) minus walk-ins and machine rooms whose fans run: their fans mix the room,
 * so a drift inside says nothing and only lets a spot there explain readings outside (no drift is fitted).
 */
export function outsideFanRooms(allowed: Uint8Array, grid: PlanGrid, plan: LocatorInput["plan"]): Uint8Array {
  const rooms = fanRoomsScale(grid, plan, 0.5);
  if (!rooms) return allowed;
  const out = new Uint8Array(allowed);
  // only the allowed cells' span can lose one (a retry screen's is its circle's; decision 0163)
  const to = allowed.lastIndexOf(1) + 1;
  for (let c = Math.max(0, allowed.indexOf(1)); c < to; c++) if (rooms[c] < 1) out[c] = 0;
  return out;
}

/**
 * Cells where a spot may lie: free, outside benign-source zones and their margin, within reach of a
 * reading, on equipment (when the plan draws any). A loop of its own, optimised on its own rather than
 * in the middle of the stage (docs/decisions/0147).
 */
function allowedCells(
  grid: PlanGrid,
  zones: Pick<ZonesResult, "inside" | "distance">,
  fields: Pick<ReadingFields, "nearestReading" | "reach">,
  onEquipment: Uint8Array | null,
  zoneMarginM: number,
  maxReachM: number,
): Uint8Array {
  const cells = grid.width * grid.height;
  const allowed = new Uint8Array(cells);
  const nearestReading = fields.nearestReading;
  // a retry screen's field reaches the rows of its circle only: no cell elsewhere is within reach
  const from = fields.reach?.from ?? 0;
  const to = fields.reach?.to ?? cells;
  for (let c = from; c < to; c++) {
    allowed[c] =
      !grid.blocked[c] &&
      !zones.inside[c] &&
      zones.distance[c] > zoneMarginM &&
      nearestReading[c] <= maxReachM &&
      (!onEquipment || onEquipment[c])
        ? 1
        : 0;
  }
  return allowed;
}

export function sourcesStage(
  plan: LocatorInput["plan"],
  grid: PlanGrid,
  lag: LagResult,
  zones: ZonesResult,
  field: FieldResult,
  settings: { kernel: KernelSettings; sources: SourceSettings; zoneMarginM: number },
  /** Fixed columns fitted with the zones' after them: the level of fixtures a pinpoint pass stilled (mixed-level.ts). */
  levels: readonly Float64Array[] = [],
): SourcesResult {
  const s = settings.sources;
  const y = lag.ppm;
  const n = y.length;
  const allowed = allowedCells(
    grid,
    zones,
    field.fields,
    equipmentMask(grid, plan, s.equipmentMarginM),
    settings.zoneMarginM,
    s.maxReachM,
  );
  let fields = field.fields;
  const drift = driftTrials(s, field.fansStir);
  if (drift.strengths.length > 0) {
    // each candidate source takes the weak drift that fits its readings best (local-drift.ts); where
    // fans stir the store the drifted kernel keeps the far-field part the fields were built with
    const k = settings.kernel;
    fields = chooseLocalDrift(
      fields,
      grid.width,
      grid.cellSize,
      field.weights,
      residualOf(y, zones.columns, zones.zoneOnlyQ),
      outsideFanRooms(allowed, grid, plan),
      {
        screeningLengthM: k.screeningLengthM,
        far: field.fansStir && k.farShare > 0 ? { lengthM: k.farScreeningLengthM, share: k.farShare } : null,
        nearCutoffM: k.nearCutoffM,
        truncationM: k.truncationM,
        strengths: drift.strengths,
        penalty: drift.penalty,
      },
    ).fields;
  }
  const prior = s.riskPointLogOdds > 0 ? riskPointPrior(grid, plan, s.riskPointLogOdds) : null;
  const rule = supportRule(field, zones, s);
  // made on first use: most stores' first spot fits too well to need the broad-rise test
  let bump: DiffuseBump | null = null;
  const broadColumn = (c: number) =>
    (bump ??= diffuseBump(
      grid,
      fanStepScale(grid, plan, settings.kernel.fanMixingScale),
      lag.cell,
      broadKernel(s.diffuseSigmaM),
    )).column(c);
  const greedy = findSources({
    fields,
    y,
    w: field.weights,
    censored: lag.censored,
    nuisance: [...zones.columns, ...levels],
    allowed,
    gridWidth: grid.width,
    cellSize: grid.cellSize,
    maxLeaks: s.maxLeaks,
    rankedRounds: s.rankedRounds,
    maxCandidates: s.maxCandidates,
    separationM: s.separationM,
    alternateFraction: s.alternateFraction,
    sourceSeparationM: s.sourceSeparationM,
    prior,
    tailReachM: s.tailReachM,
    credible: (c, column, _q, b, residual, delta, fitted) => {
      if (delta < s.minDeltaChi2) return false;
      const sup = supportingReadings(rule, column, b, residual);
      if (sup.length < s.minSupport) return false;
      // Whether there is a leak at all, where the plan lists a benign source: a weak fit must show a peak,
      // not only a broad rise, which is most simply that source's gas stirred by fans (diffuse-bump.ts).
      // Elsewhere a broad rise is still checked by hand: it may be a leak smeared by fans or a wrong delay.
      if (
        fitted === 0 &&
        zones.columns.length > 0 &&
        delta < s.broadRiseDeltaChi2 &&
        pointOverBroad(residual, field.weights, lag.censored, broadColumn(c), column) < s.minPeakOverBroad
      )
        return false;
      // Within reach of a benign-source zone, a spot must read more than the zone does: gas spreading
      // from the zone thins out with distance, so weaker readings there are most simply the zone's.
      const z = zones.nearest[c];
      if (z >= 0 && zones.distance[c] <= zones.reachM) return sup.some((i) => y[i] > zones.level[z]);
      return true;
    },
  });
  const dof = Math.max(1, n - 2 - greedy.sources.length - zones.columns.length - levels.length);
  return {
    fields,
    allowed,
    prior,
    found: greedy.sources,
    fit: greedy.fit,
    firstScan: greedy.firstScan,
    residualVariance: Math.max(1, greedy.chi2Final / dof),
  };
}
