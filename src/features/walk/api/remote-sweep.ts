import { getSweep, getSweepReadings } from "../../../entities/sweeps/sweeps-api";
import type { LocalReading, LocalSweep } from "../model/local-types";
import type { WalkDb } from "../model/walk-db";
import { SYNCED } from "../model/reading-sync";
import { SWEEP_ON_SERVER } from "../model/sweep-sync";
import { DEFAULT_RESTORE_AFTER_MIN } from "../model/pinpoint-pass";

/**
 * A sweep this device does not hold (opened from another device's link): copy it and its
 * readings from the server into IndexedDB, so the Walk screen works the same from here on.
 */
export async function pullSweep(db: WalkDb, sweepId: string): Promise<LocalSweep> {
  const s = await getSweep(sweepId);
  const readings = await getSweepReadings(sweepId);
  const local: LocalSweep = {
    id: s.id,
    storeId: s.storeId,
    planId: s.planId,
    detectorId: s.detectorId,
    detectorName: s.detectorName,
    systemIds: s.systemIds,
    fans: s.fans,
    defrost: s.defrost,
    startedAt: s.startedAt,
    status: s.status,
    transportDelayS: s.transportDelayS,
    timeConstantS: s.timeConstantS,
    alarmPpm: s.alarmPpm,
    warnings: s.warnings,
    sync: SWEEP_ON_SERVER,
    // the device keeps its own reminder; a pass pulled from the server gets the default
    passes: s.passes.map((p) => ({
      id: p.id,
      fans: p.fans,
      defrost: p.defrost,
      fixtureId: p.fixtureId,
      startedAt: p.startedAt,
      endedAt: p.endedAt,
      restoreAfterMin: DEFAULT_RESTORE_AFTER_MIN,
      sync: { kind: "on-server" as const },
    })),
  };
  const tx = db.transaction(["sweeps", "readings", "meta"], "readwrite");
  await tx.objectStore("sweeps").put(local);
  let seq = (await tx.objectStore("meta").get("seq")) ?? 0;
  for (const r of readings) {
    const existing = await tx.objectStore("readings").get(r.id);
    if (existing) continue;
    const row: LocalReading = {
      id: r.id,
      sweepId,
      seq: ++seq,
      x: r.x,
      y: r.y,
      takenAt: r.takenAt,
      ppm: r.ppm,
      atLeast: r.atLeast,
      samplePoint: r.samplePoint,
      note: r.note,
      passId: r.passId,
      sync: SYNCED,
    };
    await tx.objectStore("readings").put(row);
  }
  await tx.objectStore("meta").put(seq, "seq");
  await tx.done;
  return local;
}
