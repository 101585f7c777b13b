import type { LocatorPlan } from "#core/domain/layout/to-locator-input";
import type { LocalReading, LocalSweep } from "./local-types";
import type { LiveRequest } from "./live-messages";

/** What the Walk screen sends its live-guide worker: the sweep's figures and every committed reading. */
export function liveRequest(
  id: number,
  sweep: Pick<LocalSweep, "transportDelayS" | "timeConstantS" | "alarmPpm" | "startedAt">,
  plan: LocatorPlan,
  readings: readonly Pick<LocalReading, "id" | "x" | "y" | "takenAt" | "ppm" | "atLeast" | "samplePoint" | "note">[],
): LiveRequest {
  const last = readings[readings.length - 1];
  return {
    id,
    plan,
    instrument: {
      transportDelayS: sweep.transportDelayS,
      timeConstantS: sweep.timeConstantS,
      alarmPpm: sweep.alarmPpm,
    },
    startedAt: sweep.startedAt,
    readings: readings.map((r) => ({
      id: r.id,
      x: r.x,
      y: r.y,
      takenAt: r.takenAt,
      ppm: r.ppm,
      atLeast: r.atLeast,
      samplePoint: r.samplePoint,
      note: r.note,
    })),
    from: last ? { x: last.x, y: last.y } : null,
  };
}
