/**
 * What the API adds to the locator's diagnostics about the instrument: an overdue calibration / bump
 * check (from the sweep's start warnings), settings that look mis-set, and an analysis run with
 * another transport delay than the detector's.
 */
import type { AnalysisDiagnostic } from "../../contracts/analysis";

export interface DetectorSnapshot {
  name: string;
  transportDelayS: number;
  timeConstantS: number;
  alarmPpm: number;
  overdueMessage: string | null;
}

// A hand detector's sample line and pump take a few seconds (Walk default 5 s, common practice, no
// published source); under 1 s or over 20 s usually means the figure was never set or was mistyped.
const DELAY_PLAUSIBLE: readonly [number, number] = [1, 20];
// Leak-search alarms of a few ppm are usual (default 2 ppm, common practice, no published source);
// above 10 ppm small leaks never alarm.
const ALARM_HIGHEST = 10;

export function detectorDiagnostics(
  d: DetectorSnapshot,
  used: { transportDelayS: number; timeConstantS: number },
): AnalysisDiagnostic[] {
  const out: AnalysisDiagnostic[] = [];
  if (d.overdueMessage) out.push({ kind: "detector-overdue", message: d.overdueMessage });
  const problems: string[] = [];
  if (d.transportDelayS < DELAY_PLAUSIBLE[0] || d.transportDelayS > DELAY_PLAUSIBLE[1]) {
    problems.push(
      `a transport delay of ${d.transportDelayS} s (hand detectors usually take ${DELAY_PLAUSIBLE[0]}–${DELAY_PLAUSIBLE[1]} s)`,
    );
  }
  if (d.timeConstantS > d.transportDelayS && d.transportDelayS > 0) {
    problems.push(
      `a response time constant (${d.timeConstantS} s) longer than its transport delay (${d.transportDelayS} s)`,
    );
  }
  if (d.alarmPpm > ALARM_HIGHEST) problems.push(`an alarm level of ${d.alarmPpm} ppm, too high to hear small leaks`);
  if (problems.length > 0) {
    out.push({
      kind: "detector-settings",
      message: `${d.name} was recorded with ${problems.join(" and ")}. Check the detector's settings; the positions on this map depend on them.`,
    });
  }
  if (used.transportDelayS !== d.transportDelayS || used.timeConstantS !== d.timeConstantS) {
    out.push({
      kind: "delay-changed",
      message: `This map uses a transport delay of ${used.transportDelayS} s and a time constant of ${used.timeConstantS} s instead of the detector's ${d.transportDelayS} s and ${d.timeConstantS} s.`,
    });
  }
  return out;
}
