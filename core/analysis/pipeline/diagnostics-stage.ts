import type { LocatorInput } from "../../contracts/locator-input";
import type {
  CorrectedReading,
  LocatorAssumptions,
  LocatorDiagnostic,
  ReadingFlag,
} from "../../contracts/locator-output";
import { cellIndexOf, type PlanGrid } from "../grid/plan-grid";
import { benignSource, fansMixing, sparseCoverage } from "../locator/diagnostics";
import { readingsWithFansOn, stilledByAPass, type ReadingAir } from "../locator/pass-air";
import type { ReportSettings, SourceSettings } from "../locator/settings";
import { MOLAR_VOLUME_25C_L } from "../locator/units";
import type { FieldResult } from "./field-stage";
import type { LagResult } from "./lag-stage";
import { round2 } from "./numbers";
import type { PlacementResult } from "./placement-stage";
import type { SourcesResult } from "./sources-stage";
import type { ZonesResult } from "./zones-stage";

/** Stage 6: what the technician should know about the sweep, each reading's correction, and the assumptions. */
export interface DiagnosticsResult {
  readonly diagnostics: readonly LocatorDiagnostic[];
  readonly readings: readonly CorrectedReading[];
  readonly assumptions: LocatorAssumptions;
}

export function diagnosticsStage(
  input: LocatorInput,
  grid: PlanGrid,
  lag: LagResult,
  zones: ZonesResult,
  field: FieldResult,
  sources: Pick<SourcesResult, "fit">,
  placement: Pick<PlacementResult, "topOneSided">,
  /** The lag the readings were moved back by (delay plus time constant), s. */
  shiftS: number,
  settings: { sources: Pick<SourceSettings, "elevatedPpm">; report: ReportSettings },
  /** Each reading's air (pinpoint passes); without it every reading is in the plan's. */
  air: ReadingAir | null = null,
): DiagnosticsResult {
  const { plan, instrument, readings } = input;
  const { xs, ys, ppm: y, censored, positions } = lag;
  const n = y.length;
  const background = field.background.ppm;
  const delayS = round2(shiftS);
  const diagnostics: LocatorDiagnostic[] = [];
  plan.fixtures.forEach((f, k) => {
    // only readings taken while this fixture's fans ran can say they mix its gas
    const keep = air && air.models.length > 1 ? readingsWithFansOn(air, k) : null;
    const pick = (v: Float64Array) => (keep ? Float64Array.from(keep, (i) => v[i]) : v);
    const d = fansMixing(f, pick(xs), pick(ys), pick(y), background, instrument.alarmPpm);
    if (d?.kind === "fans-mixing") diagnostics.push(air && stilledByAPass(air, k) ? { ...d, stilledByPass: true } : d);
  });
  plan.backgroundZones.forEach((zone, z) => {
    let explained = 0;
    let peak = 0;
    for (let i = 0; i < n; i++) {
      if (zones.zoneOfReading[i] === z && y[i] - background >= settings.sources.elevatedPpm) {
        explained++;
        peak = Math.max(peak, y[i]);
      }
    }
    const d = sources.fit.q[z] > 0 ? benignSource(zone, explained, peak) : null;
    if (d) diagnostics.push(d);
  });
  const coverage = sparseCoverage(
    Float64Array.from(readings, (r) => r.x),
    Float64Array.from(readings, (r) => r.y),
    settings.report.coverageGapM,
  );
  if (coverage) diagnostics.push(coverage);
  if (placement.topOneSided) {
    diagnostics.push({ kind: "one-sided-pass" });
  }
  const early = positions.filter((l) => l.beforeDelay).length;
  if (early > 0) {
    diagnostics.push({ kind: "early-readings", count: early, shiftS: delayS });
  }
  const over = censored.reduce((a, b) => a + b, 0);
  if (over > 0) {
    diagnostics.push({ kind: "over-range", count: over });
  }

  const corrected: CorrectedReading[] = readings.map((r, i) => {
    const flags: ReadingFlag[] = [];
    if (positions[i].beforeDelay) flags.push("before-delay");
    if (positions[i].pathGap) flags.push("path-gap");
    if (grid.blocked[cellIndexOf(grid, xs[i], ys[i])]) flags.push("snapped");
    if (censored[i]) flags.push("over-range");
    if (zones.zoneOfReading[i] >= 0) flags.push("in-benign-zone");
    return {
      index: i,
      raw: { x: r.x, y: r.y },
      corrected: { x: round2(xs[i]), y: round2(ys[i]) },
      t: r.t,
      ppm: r.ppm,
      flags,
    };
  });

  const rep = settings.report;
  return {
    diagnostics,
    readings: corrected,
    assumptions: {
      shiftS: delayS,
      mixingHeightM: rep.mixingHeightM,
      airChangesPerH: rep.airChangesPerH,
      molarVolumeL: MOLAR_VOLUME_25C_L,
      temperatureC: 25,
      pressureKPa: 101.325,
    },
  };
}
