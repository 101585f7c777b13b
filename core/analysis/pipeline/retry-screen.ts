import type { LocatorInput } from "../../contracts/locator-input";
import type { PlanGrid } from "../grid/plan-grid";
import { casesRunFans } from "../locator/plan-masks";
import type { LocatorSettings } from "../locator/settings";
import { fieldStage, type OtherAir } from "./field-stage";
import type { LagResult } from "./lag-stage";
import { sourcesStage } from "./sources-stage";
import type { ZonesResult } from "./zones-stage";

/** What the field and sources stages need to fit every pass (locate.ts works it out per lag). */
export interface PassFit {
  /** The pinpoint passes' own air (null: one pass, or none that changes the air). */
  readonly otherAir: OtherAir | null;
  /** One fixed column per stilled fixture whose mixed readings say its level only (locator/mixed-level.ts). */
  readonly levelColumns: readonly Float64Array[];
}

export const NO_PASSES: PassFit = { otherAir: null, levelColumns: [] };

// Cells this close to the plume's peak reading are the ones the screen judges, m: a spot that fits a
// plume lies by its strongest reading, and a lag the screen tries moves that reading with the rest.
const PLUME_REGION_M = 6;

/**
 * Whether a spot fits the plume with this lag, judged on the plume alone before a full run is spent on
 * it. Only the readings within reach of the cells around the peak reading are searched (the costly part
 * of the field stage); every reading still counts in the background, weights and totals of the fit, so
 * for the cells around the peak the fit is the full run's. The full run takes its first source from the
 * best cell of the whole plan, the screen from the best cell around the peak: they differ only when a
 * better-fitting cell lies farther from the peak (or gas reaches a cell of the region through a
 * fan-stirred room from farther than the straight-line cut-off), and then a retry may be skipped that a
 * full run would have kept. The benchmark sets showed no such store (docs/locator/pipeline.md).
 * Every pass is seen as the full run sees it (`passes`): each reading searched in its own air, a
 * stilled fixture's mixed readings as its level only.
 */
export function spotFitsPlume(
  plan: LocatorInput["plan"],
  grid: PlanGrid,
  stepScale: Float32Array | null,
  lag: LagResult,
  zones: ZonesResult,
  peak: number,
  settings: LocatorSettings,
  passes: PassFit = NO_PASSES,
): boolean {
  const k = settings.kernel;
  const n = lag.ppm.length;
  const px = lag.xs[peak];
  const py = lag.ys[peak];
  // a reading farther than this (straight line) from the peak reaches no cell of the region within the
  // kernel's truncation, give or take the snapping of positions to cells
  const reachM = PLUME_REGION_M + k.truncationM + 2 * grid.cellSize;
  const searched = new Uint8Array(n);
  for (let i = 0; i < n; i++) searched[i] = Math.hypot(lag.xs[i] - px, lag.ys[i] - py) <= reachM ? 1 : 0;
  // only the region's cells are read below, so the searches need not step on from cells that cannot reach
  // it, and the field keeps nothing outside it: cells there are ruled out as a spot out of every
  // reading's reach is (their nearest reading is Infinity)
  const focus = { x: px, y: py, radiusM: PLUME_REGION_M };
  const field = fieldStage(
    grid,
    stepScale,
    casesRunFans(plan.fixtures),
    lag,
    zones,
    settings,
    searched,
    passes.otherAir,
    focus,
  );
  const sources = sourcesStage(
    plan,
    grid,
    lag,
    zones,
    field,
    {
      kernel: k,
      // only whether a first source is credible is read: no further rounds or alternatives
      sources: { ...settings.sources, maxLeaks: 1, maxCandidates: 1 },
      zoneMarginM: settings.zones.marginM,
    },
    passes.levelColumns,
  );
  return sources.found.length > 0;
}
