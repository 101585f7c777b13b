import { gridCellCount, LocatorInputError, MAX_GRID_CELLS, type LocatorInput } from "../contracts/locator-input";
import type { DelayFacts, LocatorResult } from "../contracts/locator-output";
import { createPlanGrid } from "./grid/plan-grid";
import { DEFAULT_LOCATOR_OPTIONS, type LocatorOptions } from "./locator/locator-options";
import { readingAir } from "./locator/pass-air";
import { casesRunFans, fanStepScale } from "./locator/plan-masks";
import { LOCATOR_SETTINGS, type LocatorSettings } from "./locator/settings";
import { delayDiagnostics, delayStage } from "./pipeline/delay-stage";
import { diagnosticsStage } from "./pipeline/diagnostics-stage";
import { fieldStage, type OtherAir } from "./pipeline/field-stage";
import { lagStage } from "./pipeline/lag-stage";
import { laterSpotsStage } from "./pipeline/later-spots";
import { oneReadingSource } from "./pipeline/one-reading";
import { passFitOf } from "./pipeline/pass-fit";
import { placementStage } from "./pipeline/placement-stage";
import { spotFitsPlume, type PassFit } from "./pipeline/retry-screen";
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
  // Pinpoint passes (fans stopped, a defrost): their readings get their own air in the field stage.
  const air = readingAir(input);
  const other: OtherAir | null =
    air.models.length > 1
      ? {
          models: air.models.slice(1).map((fixtures) => ({
            fansStir: casesRunFans([...fixtures]),
            stepScale:
              k.fanMixingScale < 1 ? fanStepScale(grid, { ...plan, fixtures: [...fixtures] }, k.fanMixingScale) : null,
          })),
          modelOfReading: air.modelOfReading,
        }
      : null;

  const lagAndZones = (shift: Pick<LocatorInput["instrument"], "transportDelayS" | "timeConstantS">) => {
    const lag = lagStage(readings, shift, grid, o.walkSpeedMps);
    const zones = zonesStage(plan.backgroundZones, instrument.alarmPpm, grid, stepScale, lag, {
      zones: settings.zones,
      noise: settings.noise,
      nearCutoffM: k.nearCutoffM,
      elevatedPpm: settings.sources.elevatedPpm,
    });
    return { lag, zones };
  };
  const passFit = ({ lag, zones }: ReturnType<typeof lagAndZones>): PassFit =>
    passFitOf(plan, grid, air, other, lag, zones, instrument.alarmPpm, settings);
  const stages = ({ lag, zones }: ReturnType<typeof lagAndZones>, fieldScale = stepScale) => {
    const { otherAir, levelColumns } = passFit({ lag, zones });
    const field = fieldStage(grid, fieldScale, casesRunFans(plan.fixtures), lag, zones, settings, null, otherAir);
    const sources = sourcesStage(
      plan,
      grid,
      lag,
      zones,
      field,
      { kernel: k, sources: settings.sources, zoneMarginM: settings.zones.marginM },
      levelColumns,
    );
    const rule = supportRule(field, zones, settings.sources);
    const placement = placementStage(plan, grid, lag, field, sources, rule, settings, [
      ...zones.columns,
      ...levelColumns,
    ]);
    return { lag, zones, field, sources, placement };
  };
  // The delay checked against the readings first: when they clearly fit another delay and nobody set
  // one by hand for this analysis, the spots are placed with the delay the readings support.
  const check = delayStage(readings, instrument, grid, o.walkSpeedMps);
  const useEstimate = o.delayFromReadings && check.supported && check.estimatedS !== null;
  let usedS = useEstimate ? check.estimatedS! : check.statedS;
  let run = stages(lagAndZones(useEstimate ? { transportDelayS: usedS, timeConstantS: 0 } : instrument));
  const peak = strongestUnexplained(run.lag.ppm, run.zones.zoneOfReading);
  const plume = peak < 0 ? 0 : run.lag.ppm[peak];
  // A plume far above the alarm that no spot fits is more likely a wrong delay than no leak: try the
  // delay the readings fit best, then a few shares of the stated one, and keep the first with which
  // a spot fits, before saying nothing was found.
  const farAbove = plume >= FAR_ABOVE_ALARMS * instrument.alarmPpm;
  const firstS = usedS;
  if (run.placement.candidates.length === 0 && farAbove) {
    const tried = new Set([usedS]);
    for (const shift of [check.estimatedS, ...RETRY_SHARES.map((f) => f * check.statedS)]) {
      if (shift === null || tried.has(shift)) continue;
      tried.add(shift);
      const trial = lagAndZones({ transportDelayS: shift, timeConstantS: 0 });
      // a full run only where the plume alone already fits a spot (the field's searches are the cost)
      if (!spotFitsPlume(plan, grid, stepScale, trial.lag, trial.zones, peak, settings, passFit(trial))) continue;
      const retry = stages(trial);
      if (retry.placement.candidates.length > 0) {
        run = retry;
        usedS = shift;
        break;
      }
    }
  }
  // Nothing fits at any delay, yet one reading stands far above the alarm: list it as a spot of its own
  // kind (one-reading.ts) rather than call the sweep clean.
  const fitted = run.placement.candidates.length;
  if (fitted === 0 && farAbove) {
    const rule = supportRule(run.field, run.zones, settings.sources);
    const one = oneReadingSource(
      run.lag,
      run.zones,
      run.sources,
      rule,
      run.field.background.ppm,
      FAR_ABOVE_ALARMS * instrument.alarmPpm,
    );
    if (one) {
      const sources = { ...run.sources, found: [one] };
      run = { ...run, sources, placement: placementStage(plan, grid, run.lag, run.field, sources, rule, settings) };
    }
  }
  // Where the display cases run their fans, the spots after the first take turns with a fit that
  // reads each case as one mixed unit (decision 0157).
  const candidates = laterSpotsStage({
    plan,
    grid,
    stepScale,
    settings,
    plain: run.placement.candidates,
    passes: other !== null,
    oneReading: run.sources.found[0]?.oneReading === true,
    rerun: (unitScale) => stages({ lag: run.lag, zones: run.zones }, unitScale).placement.candidates,
  });
  if (candidates) run = { ...run, placement: { ...run.placement, candidates } };
  const { lag, zones, field, sources, placement } = run;
  const report = diagnosticsStage(input, grid, lag, zones, field, sources, placement, usedS, settings, air);
  const delay: DelayFacts = {
    statedS: round2(check.statedS),
    estimatedS: check.estimatedS,
    supported: check.supported,
    usedS: round2(usedS),
    statedMisfit: check.statedMisfit === null ? null : round3(check.statedMisfit),
    estimatedMisfit: check.estimatedMisfit === null ? null : round3(check.estimatedMisfit),
  };
  const delayNotes = delayDiagnostics(delay, usedS !== firstS, fitted, plume, instrument.alarmPpm, farAbove);

  return {
    candidates: [...placement.candidates],
    background: { ppm: round2(field.background.ppm) },
    diagnostics: [...report.diagnostics, ...delayNotes],
    assumptions: report.assumptions,
    readings: [...report.readings],
    field: field.map,
    delay,
  };
}

// "Far above the alarm": a plume this many times the alarm level is never reported as no leak
// without trying other delays and saying the delay may be why (common practice, no published source).
const FAR_ABOVE_ALARMS = 4;
// Shares of the stated shift tried, in this order, when such a plume fits no spot: a delay entered
// twice too long or too short is the usual mistake, a longer hose or a worn pump changes it less.
const RETRY_SHARES = [0.5, 2, 0.75, 1.5];

const round3 = (v: number) => Math.round(v * 1000) / 1000;

/** The highest reading that no active benign-source zone explains (its index; -1 when none is above 0). */
function strongestUnexplained(ppm: Float64Array, zoneOfReading: Int32Array): number {
  let top = -1;
  for (let i = 0; i < ppm.length; i++) if (zoneOfReading[i] < 0 && ppm[i] > (top < 0 ? 0 : ppm[top])) top = i;
  return top;
}
