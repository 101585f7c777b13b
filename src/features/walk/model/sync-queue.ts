import type { ReadingInput } from "#core/contracts/sweeps";
import { READINGS_BATCH_MAX } from "#core/contracts/sweeps";
import { syncFindings } from "./finding-queue";
import type { LocalReading, ReadingValues } from "./local-types";
import {
  afterEditConfirmed,
  afterRefused,
  afterUploadConfirmed,
  editedAtOf,
  isOnServer,
  QUEUED_RANGE,
} from "./reading-sync";
import { afterSweepCreated, afterSweepRefused, sweepOnServer } from "./sweep-sync";
import { passConfirmed, passRefused } from "./pinpoint-pass";
import { RefusedError, type SyncTransport } from "./sync-transport";
import type { WalkDb } from "./walk-db";

export interface SyncReport {
  /** Readings the server confirmed in this pass (stored now or already). */
  confirmed: number;
  rejected: number;
  /** Sweeps whose submit the server confirmed in this pass. */
  submitted: number;
  /** Why the pass stopped early (offline, server down, signed out); null when it got through. */
  stoppedBy: string | null;
}

/** 401 means the session ended: nothing is wrong with the data, so it stays queued. */
function isRefusal(e: unknown): e is RefusedError {
  return e instanceof RefusedError && e.status !== 401;
}

function reasonsOf(e: RefusedError): Record<string, string> {
  return Object.keys(e.fields).length ? e.fields : { "": e.message };
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
    // older rows read before the version 5 upgrade ran have no passId: the first pass
    ...(r.passId ? { passId: r.passId } : {}),
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
  const report: SyncReport = { confirmed: 0, rejected: 0, submitted: 0, stoppedBy: null };
  try {
    for (const s of await db.getAll("sweeps")) {
      if (s.sync.kind !== "queued-new") continue;
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
        await db.put("sweeps", { ...s, sync: afterSweepCreated(s.sync) });
      } catch (e) {
        if (!isRefusal(e)) throw e;
        await db.put("sweeps", { ...s, sync: afterSweepRefused(s.sync, reasonsOf(e)) });
      }
    }
    // Passes before readings: a reading names its pass, which the server must know first.
    for (const s of await db.getAll("sweeps")) {
      if (sweepOnServer(s.sync)) await sendPasses(db, transport, s.id);
    }
    const sweeps = new Map((await db.getAll("sweeps")).map((s) => [s.id, s]));
    const onServer = (sweepId: string) => {
      const s = sweeps.get(sweepId);
      return s !== undefined && sweepOnServer(s.sync);
    };
    const all = (await db.getAllFromIndex("readings", "bySync", IDBKeyRange.bound(...QUEUED_RANGE))).sort(
      (a, b) => a.seq - b.seq,
    );
    const fresh = all.filter((r) => r.sync.kind === "queued-new" && onServer(r.sweepId));
    const bySweep = new Map<string, LocalReading[]>();
    for (const r of fresh) bySweep.set(r.sweepId, [...(bySweep.get(r.sweepId) ?? []), r]);
    for (const [sweepId, list] of bySweep) {
      for (let i = 0; i < list.length; i += batchSize)
        await uploadBatch(db, transport, sweepId, list.slice(i, i + batchSize), report);
    }
    // Pinpointed leaks after the readings: their sweep must be on the server.
    const leaks = await syncFindings(db, transport, onServer);
    report.confirmed += leaks.confirmed;
    report.rejected += leaks.rejected;
    for (const r of all) {
      if (r.sync.kind === "queued-delete") await sendDelete(db, transport, r, report);
      else if (r.sync.kind === "queued-edit") await sendEdit(db, transport, r, report);
    }
    for (const s of await db.getAll("sweeps")) {
      if (s.sync.kind !== "queued-submit") continue;
      // An open reading still on a keypad holds the submit back too: it belongs to the sweep.
      const left = [
        ...(await db.getAllFromIndex("readings", "bySync", IDBKeyRange.bound(...QUEUED_RANGE))),
        ...(await db.getAllFromIndex("readings", "bySync", "draft")),
      ].some((r) => r.sweepId === s.id);
      if (left) continue;
      await transport.submitSweep(s.id);
      await db.put("sweeps", { ...s, sync: { kind: "on-server" }, status: "submitted" });
      report.submitted++;
    }
  } catch (e) {
    report.stoppedBy = e instanceof Error ? e.message : String(e);
  }
  return report;
}

/** Sends each queued pass of a sweep; a refused one keeps its reasons and never blocks the others. */
async function sendPasses(db: WalkDb, transport: SyncTransport, sweepId: string): Promise<void> {
  const sweep = await db.get("sweeps", sweepId);
  for (const p of sweep?.passes ?? []) {
    if (p.sync.kind !== "queued") continue;
    try {
      await transport.savePass(sweepId, p.id, {
        fans: p.fans,
        defrost: p.defrost,
        fixtureId: p.fixtureId,
        startedAt: p.startedAt,
        endedAt: p.endedAt,
      });
      const now = await db.get("sweeps", sweepId);
      if (now) await db.put("sweeps", passConfirmed(now, p));
    } catch (e) {
      if (!isRefusal(e)) throw e;
      const now = await db.get("sweeps", sweepId);
      if (now) await db.put("sweeps", passRefused(now, p.id, reasonsOf(e)));
    }
  }
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
    for (const r of list) reasons.set(r.id, reasonsOf(e));
  }
  const sent = new Map(list.map((r) => [r.id, valuesKey(r)]));
  // One transaction, requests pipelined (not awaited one by one): a thousand readings are marked
  // in one round of IndexedDB work. Relaxed durability is safe here: if this marking were lost,
  // the readings would be sent again and the server would count them as duplicates.
  const tx = db.transaction("readings", "readwrite", { durability: "relaxed" });
  const ids = [...sent.keys()];
  const current = await Promise.all(ids.map((id) => tx.store.get(id)));
  const stamp = new Date().toISOString();
  const writes: Promise<unknown>[] = [];
  current.forEach((now, i) => {
    const id = ids[i];
    if (!now) return;
    if (confirmed.has(id)) {
      report.confirmed++;
      // Changed on the keypad while the upload was in flight: the server has the old values.
      const changed = valuesKey(now) !== sent.get(id);
      writes.push(tx.store.put({ ...now, sync: afterUploadConfirmed(now.sync, changed, stamp) }));
    } else if (reasons.has(id) && valuesKey(now) === sent.get(id) && !isOnServer(now.sync)) {
      report.rejected++;
      writes.push(tx.store.put({ ...now, sync: afterRefused(now.sync, reasons.get(id)!) }));
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
      ...(editedAtOf(r.sync) ? { editedAt: editedAtOf(r.sync)! } : {}),
    });
  } catch (e) {
    if (!isRefusal(e)) throw e;
    if (e.status === 404) {
      await db.delete("readings", r.id); // deleted on another device; the server's audit has it
      return;
    }
    report.rejected++;
    await db.put("readings", { ...r, sync: afterRefused(r.sync, reasonsOf(e)) });
    return;
  }
  const now = await db.get("readings", r.id);
  if (now) await db.put("readings", { ...now, sync: afterEditConfirmed(now.sync, valuesKey(now) !== key) });
}

async function sendDelete(db: WalkDb, transport: SyncTransport, r: LocalReading, report: SyncReport): Promise<void> {
  try {
    await transport.deleteReading(r.sweepId, r.id, editedAtOf(r.sync));
  } catch (e) {
    if (!isRefusal(e)) throw e;
    if (e.status !== 404) {
      // e.g. the sweep was reviewed meanwhile: keep it, say why, and go on with the rest.
      report.rejected++;
      await db.put("readings", { ...r, sync: afterRefused(r.sync, reasonsOf(e)) });
      return;
    }
  }
  await db.delete("readings", r.id);
}
