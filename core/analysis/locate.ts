import { gridCellCount, LocatorInputError, MAX_GRID_CELLS, type LocatorInput } from "../contracts/locator-input";
import type { LocatorResult } from "../contracts/locator-output";
import { createPlanGrid } from "./grid/plan-grid";
import { DEFAULT_LOCATOR_OPTIONS, type LocatorOptions } from "./locator/locator-options";
import { casesRunFans, fanStepScale } from "./locator/plan-masks";
import { LOCATOR_SETTINGS, type LocatorSettings } from "./locator/settings";
import { diagnosticsStage } from "./pipeline/diagnostics-stage";
import { fieldStage } from "./pipeline/field-stage";
import { lagStage } from "./pipeline/lag-stage";
import { placementStage } from "./pipeline/placement-stage";
import { round2 } from "./pipeline/numbers";
import { sourcesStage, supportRule } from "./pipeline/sources-stage";
import { zonesStage } from "./pipeline/zones-stage";

export type { LocatorOptions } from "./locator/locator-options";

/**
 * The locator (docs/locator/method.md, stages in docs/locator/pipeline.md): lag-corrected readings, a
 * confidence-weighted concentration field and ranked suspect spots with diagnostics. Each stage is a pure
 * function of the results before it: lag → benign zones → field → sources → placement → diagnostics.
 * Deterministic for the same input and options. The input must already satisfy locatorInputSchema
 * (parseLocatorInput).
 */
export function locate(
  input: LocatorInput,
  options: Partial<LocatorOptions> = {},
  settings: LocatorSettings = LOCATOR_SETTINGS,
): LocatorResult {
  const o: LocatorOptions = { ...DEFAULT_LOCATOR_OPTIONS, ...options };
  const { plan, instrument, readings } = input;
  if (!(o.cellSize > 0))
    throw new LocatorInputError([`options.cellSize: must be a positive number of metres, got ${o.cellSize}`]);
  const cellsNeeded = gridCellCount(plan.width, plan.height, o.cellSize);
  if (cellsNeeded > MAX_GRID_CELLS) {
    throw new LocatorInputError([
      `plan: a ${plan.width} m x ${plan.height} m plan needs ${cellsNeeded} cells at ${o.cellSize} m, over the memory budget of ${MAX_GRID_CELLS}`,
    ]);
  }
  if (readings.length === 0) throw new LocatorInputError(["readings: must not be empty"]);

  const grid = createPlanGrid(
    plan.width,
    plan.height,
    o.cellSize,
    plan.obstacles.map((b) => b.polygon),
  );
  const k = settings.kernel;
  const stepScale = k.fanMixingScale < 1 ? fanStepScale(grid, plan, k.fanMixingScale) : null;

  const lag = lagStage(readings, instrument, grid, o.walkSpeedMps);
  const zones = zonesStage(plan.backgroundZones, instrument.alarmPpm, grid, stepScale, lag, {
    zones: settings.zones,
    noise: settings.noise,
    nearCutoffM: k.nearCutoffM,
    elevatedPpm: settings.sources.elevatedPpm,
  });
  const field = fieldStage(grid, stepScale, casesRunFans(plan.fixtures), lag, zones, settings);
  const sources = sourcesStage(plan, grid, lag, zones, field, {
    kernel: k,
    sources: settings.sources,
    zoneMarginM: settings.zones.marginM,
  });
  const placement = placementStage(
    plan,
    grid,
    lag,
    field,
    sources,
    supportRule(field, zones, settings.sources),
    settings,
  );
  const report = diagnosticsStage(input, grid, lag, zones, field, sources, placement, settings);

  return {
    candidates: [...placement.candidates],
    background: { ppm: round2(field.background.ppm) },
    diagnostics: [...report.diagnostics],
    assumptions: [...report.assumptions],
    readings: [...report.readings],
    field: field.map,
  };
}
