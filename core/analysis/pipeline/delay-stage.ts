import type { LocatorInstrument, LocatorReading } from "../../contracts/locator-input";
import type { DelayFacts, LocatorDiagnostic } from "../../contracts/locator-output";
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

/** What the delay check tells the technician: a better-fitting delay, or why a strong plume found no spot. */
export function delayDiagnostics(
  delay: DelayFacts,
  /** No spot fitted with the delay first used, so the spots come from a retry with another delay. */
  retried: boolean,
  candidates: number,
  plumePpm: number,
  alarmPpm: number,
  farAbove: boolean,
): LocatorDiagnostic[] {
  const out: LocatorDiagnostic[] = [];
  const plume = { plumePpm: Math.round(plumePpm * 100) / 100, alarmPpm, statedS: delay.statedS };
  if (retried) out.push({ kind: "delay-uncertain", ...plume, usedS: delay.usedS });
  else if (candidates === 0 && farAbove) out.push({ kind: "delay-uncertain", ...plume, usedS: null });
  if (delay.supported && delay.estimatedS !== null && !retried) {
    out.push({
      kind: "delay-check",
      statedS: delay.statedS,
      estimatedS: delay.estimatedS,
      used: delay.usedS === delay.estimatedS,
    });
  }
  return out;
}
