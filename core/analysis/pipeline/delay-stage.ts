import type { LocatorInstrument, LocatorReading } from "../../contracts/locator-input";
import type { DelayFacts, Diagnostic } from "../../contracts/locator-output";
import type { PlanGrid } from "../grid/plan-grid";
import { checkDelay, type DelayCheck } from "../lag/delay-check";
import { gridRoute } from "../lag/grid-route";
import { estimateBackground } from "../locator/background";

/**
 * The detector's delay checked against the readings, before any stage uses it. "Raised" readings are
 * judged against the lower quartile of the exact readings (the background of the field stage, before
 * benign-source zones are known).
 */
export function delayStage(
  readings: readonly LocatorReading[],
  instrument: Pick<LocatorInstrument, "transportDelayS" | "timeConstantS">,
  grid: PlanGrid,
  walkSpeedMps: number,
): DelayCheck {
  const ppm = Float64Array.from(readings, (r) => r.ppm);
  const exact = Uint8Array.from(readings, (r) => (r.atLeast ? 0 : 1));
  return checkDelay(
    readings,
    instrument.transportDelayS + instrument.timeConstantS,
    estimateBackground(ppm, exact).ppm,
    gridRoute(grid),
    walkSpeedMps > 0 ? walkSpeedMps : undefined,
  );
}

const s1 = (v: number) => (Math.round(v * 10) / 10).toString();

/** What the delay check tells the technician: a better-fitting delay, or why a strong plume found no spot. */
export function delayDiagnostics(
  delay: DelayFacts,
  /** No spot fitted with the delay first used, so the spots come from a retry with another delay. */
  retried: boolean,
  candidates: number,
  plumePpm: number,
  alarmPpm: number,
  farAbove: boolean,
): Diagnostic[] {
  const out: Diagnostic[] = [];
  if (retried) {
    out.push({
      kind: "delay-uncertain",
      message: `No spot fitted the readings (up to ${s1(plumePpm)} ppm, ${s1(plumePpm / alarmPpm)} times the alarm) with the detector's ${s1(delay.statedS)} s delay; the spots listed use ${s1(delay.usedS)} s, with which they fit best. Check the detector's delay and sweep the spot again.`,
    });
  } else if (candidates === 0 && farAbove) {
    out.push({
      kind: "delay-uncertain",
      message: `Readings reach ${s1(plumePpm)} ppm, ${s1(plumePpm / alarmPpm)} times the alarm, yet no single spot explains them: this is not a clean sweep. The detector's delay (${s1(delay.statedS)} s) may be wrong or the gas may come from several places; walk the area of the highest readings again slowly, in both directions.`,
    });
  }
  if (delay.supported && delay.estimatedS !== null && !retried) {
    out.push({
      kind: "delay-check",
      message:
        `The readings fit a ${s1(delay.estimatedS)} s delay better than the detector's ${s1(delay.statedS)} s (passes over the same spots agree better)` +
        (delay.usedS === delay.estimatedS
          ? `, so the spots are placed with ${s1(delay.estimatedS)} s. If this repeats, measure the detector's delay again and update it.`
          : `. If this repeats, measure the detector's delay again and update it.`),
    });
  }
  return out;
}
