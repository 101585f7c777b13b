import type { ReadingInput } from "#core/contracts/sweeps";
import { READINGS_BATCH_MAX } from "#core/contracts/sweeps";
import { syncFindings } from "./finding-queue";
import type { LocalReading, ReadingValues } from "./local-types";
import { RefusedError, type SyncTransport } from "./sync-transport";
import type { WalkDb } from "./walk-db";

export interface SyncReport {
  /** Readings the server confirmed in this pass (stored now or already). */
  confirmed: number;
  rejected: number;
  /** Why the pass stopped early (offline, server down, signed out); null when it got through. */
  stoppedBy: string | null;
}

/** 401 means the session ended: nothing is wrong with the data, so it stays queued. */
function isRefusal(e: unknown): e is RefusedError {
  return e instanceof RefusedError && e.status !== 401;
}

function valuesKey(r: ReadingValues): string {
  return JSON.stringify([r.x, r.y, r.takenAt, r.ppm, r.atLeast, r.samplePoint, r.note]);
}

function toInput(r: LocalReading): ReadingInput {
  return {
    id: r.id,
    x: r.x,
    y: r.y,
    takenAt: r.takenAt,
    ppm: r.ppm,
    atLeast: r.atLeast,
    samplePoint: r.samplePoint,
    note: r.note,
  };
}

/**
 * One pass of the queue: sweeps first (a reading needs its sweep), then new readings in batches,
 * then pinpointed leaks (findings with their photos), then edits, deletes and submits. A rejected reading is marked with its reasons and left on the
 * device; it never blocks the readings behind it. A lost connection stops the pass; the next
 * pass picks up where this one stopped, and the server's idempotency makes any resend harmless.
 */
export async function syncOnce(
  db: WalkDb,
  transport: SyncTransport,
  batchSize = READINGS_BATCH_MAX,
): Promise<SyncReport> {
  const report: SyncReport = { confirmed: 0, rejected: 0, stoppedBy: null };
  try {
    for (const s of await db.getAll("sweeps")) {
      if (s.onServer || s.rejected) continue;
      try {
        await transport.createSweep(s.storeId, {
          id: s.id,
          planId: s.planId,
          detectorId: s.detectorId,
          systemIds: s.systemIds,
          fans: s.fans,
          defrost: s.defrost,
          startedAt: s.startedAt,
        });
        await db.put("sweeps", { ...s, onServer: true });
      } catch (e) {
        if (!isRefusal(e)) throw e;
        await db.put("sweeps", { ...s, rejected: Object.keys(e.fields).length ? e.fields : { "": e.message } });
      }
    }
    const sweeps = new Map((await db.getAll("sweeps")).map((s) => [s.id, s]));
    const all = (await db.getAllFromIndex("readings", "byState", "pending")).sort((a, b) => a.seq - b.seq);
    const fresh = all.filter(
      (r) => !r.onServer && !r.draft && !r.deletePending && r.state === "pending" && sweeps.get(r.sweepId)?.onServer,
    );
    const bySweep = new Map<string, LocalReading[]>();
    for (const r of fresh) bySweep.set(r.sweepId, [...(bySweep.get(r.sweepId) ?? []), r]);
    for (const [sweepId, list] of bySweep) {
      for (let i = 0; i < list.length; i += batchSize)
        await uploadBatch(db, transport, sweepId, list.slice(i, i + batchSize), report);
    }
    // Pinpointed leaks after the readings: their sweep must be on the server.
    const leaks = await syncFindings(db, transport, (id) => sweeps.get(id)?.onServer === true);
    report.confirmed += leaks.confirmed;
    report.rejected += leaks.rejected;
    for (const r of all) {
      if (r.onServer && r.deletePending && r.state === "pending") await sendDelete(db, transport, r);
      else if (r.onServer && r.editPending && r.state === "pending") await sendEdit(db, transport, r, report);
    }
    for (const s of await db.getAll("sweeps")) {
      if (!s.submitPending || !s.onServer) continue;
      // An open reading still on a keypad holds the submit back too: it belongs to the sweep.
      const left = [
        ...(await db.getAllFromIndex("readings", "byState", "pending")),
        ...(await db.getAllFromIndex("readings", "byState", "draft")),
      ].some((r) => r.sweepId === s.id);
      if (left) continue;
      await transport.submitSweep(s.id);
      await db.put("sweeps", { ...s, submitPending: false, status: "submitted" });
    }
  } catch (e) {
    report.stoppedBy = e instanceof Error ? e.message : String(e);
  }
  return report;
}

async function uploadBatch(
  db: WalkDb,
  transport: SyncTransport,
  sweepId: string,
  list: LocalReading[],
  report: SyncReport,
): Promise<void> {
  let confirmed: Set<string>;
  const reasons = new Map<string, Record<string, string>>();
  try {
    const result = await transport.uploadReadings(sweepId, list.map(toInput));
    confirmed = new Set([...result.stored, ...result.duplicates]);
    for (const r of result.rejected) if (r.id) reasons.set(r.id, r.reasons);
  } catch (e) {
    if (!isRefusal(e)) throw e;
    // The whole batch was refused (e.g. the sweep was reviewed): each reading keeps the reason.
    confirmed = new Set();
    for (const r of list) reasons.set(r.id, Object.keys(e.fields).length ? e.fields : { "": e.message });
  }
  const sent = new Map(list.map((r) => [r.id, valuesKey(r)]));
  // One transaction, requests pipelined (not awaited one by one): a thousand readings are marked
  // in one round of IndexedDB work. Relaxed durability is safe here: if this marking were lost,
  // the readings would be sent again and the server would count them as duplicates.
  const tx = db.transaction("readings", "readwrite", { durability: "relaxed" });
  const ids = [...sent.keys()];
  const current = await Promise.all(ids.map((id) => tx.store.get(id)));
  const writes: Promise<unknown>[] = [];
  current.forEach((now, i) => {
    const id = ids[i];
    if (!now) return;
    if (confirmed.has(id)) {
      report.confirmed++;
      // Changed on the keypad while the upload was in flight: the server has the old values.
      const changed = valuesKey(now) !== sent.get(id);
      writes.push(
        tx.store.put({
          ...now,
          onServer: true,
          state: changed || now.deletePending ? "pending" : "synced",
          editPending: changed,
          reasons: null,
        }),
      );
    } else if (reasons.has(id) && valuesKey(now) === sent.get(id)) {
      report.rejected++;
      writes.push(tx.store.put({ ...now, state: "rejected", reasons: reasons.get(id)! }));
    }
  });
  await Promise.all(writes);
  await tx.done;
}

async function sendEdit(db: WalkDb, transport: SyncTransport, r: LocalReading, report: SyncReport): Promise<void> {
  const key = valuesKey(r);
  try {
    await transport.editReading(r.sweepId, r.id, {
      x: r.x,
      y: r.y,
      takenAt: r.takenAt,
      ppm: r.ppm,
      atLeast: r.atLeast,
      samplePoint: r.samplePoint,
      note: r.note,
      ...(r.editedAt ? { editedAt: r.editedAt } : {}),
    });
  } catch (e) {
    if (!isRefusal(e)) throw e;
    if (e.status === 404) {
      await db.delete("readings", r.id); // deleted on another device; the server's audit has it
      return;
    }
    report.rejected++;
    await db.put("readings", {
      ...r,
      state: "rejected",
      reasons: Object.keys(e.fields).length ? e.fields : { "": e.message },
    });
    return;
  }
  const now = await db.get("readings", r.id);
  if (now && valuesKey(now) === key && !now.deletePending)
    await db.put("readings", { ...now, editPending: false, state: "synced", reasons: null });
}

async function sendDelete(db: WalkDb, transport: SyncTransport, r: LocalReading): Promise<void> {
  try {
    await transport.deleteReading(r.sweepId, r.id, r.editedAt);
  } catch (e) {
    if (!isRefusal(e)) throw e;
    if (e.status !== 404) {
      // e.g. the sweep was reviewed meanwhile: keep it, say why, and go on with the rest.
      await db.put("readings", {
        ...r,
        state: "rejected",
        reasons: Object.keys(e.fields).length ? e.fields : { "": e.message },
      });
      return;
    }
  }
  await db.delete("readings", r.id);
}
