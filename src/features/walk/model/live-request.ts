import type { LocatorPlan } from "#core/domain/layout/to-locator-input";
import type { LocalPass, LocalReading, LocalSweep } from "./local-types";
import type { LiveRequest } from "./live-messages";

type PassConditions = Pick<LocalPass, "id" | "fans" | "defrost" | "fixtureId">;

/**
 * What the Walk screen sends its live-guide worker: the sweep's figures, its pinpoint passes and every
 * committed reading with its pass, so the live fit sees each reading in its own air as the server's
 * analysis will. A pass the sweep does not list (none on the device should) leaves its readings in
 * the first pass rather than failing the estimate.
 */
export function liveRequest(
  id: number,
  sweep: Pick<LocalSweep, "transportDelayS" | "timeConstantS" | "alarmPpm" | "startedAt"> & {
    passes?: readonly PassConditions[];
  },
  plan: LocatorPlan,
  readings: readonly (Pick<LocalReading, "id" | "x" | "y" | "takenAt" | "ppm" | "atLeast" | "samplePoint" | "note"> & {
    passId?: string | null;
  })[],
): LiveRequest {
  const last = readings[readings.length - 1];
  const passes = (sweep.passes ?? []).map((p) => ({
    id: p.id,
    fans: p.fans,
    defrost: p.defrost,
    fixtureId: p.fixtureId,
  }));
  const known = new Set(passes.map((p) => p.id));
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
      passId: r.passId && known.has(r.passId) ? r.passId : null,
    })),
    passes,
    from: last ? { x: last.x, y: last.y } : null,
  };
}
