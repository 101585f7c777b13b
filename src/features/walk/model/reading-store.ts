import { findingCounts } from "./finding-queue";
import type { WalkDb } from "./walk-db";
import type { LocalReading, LocalSweep, ReadingValues } from "./local-types";
import { afterRemove, afterValuesChange, DRAFT, isDeleted, isQueued, QUEUED_NEW, QUEUED_RANGE } from "./reading-sync";
import type { LocalSweepSummary } from "./resume-list";
import { sweepWaits } from "./sweep-sync";

/**
 * "relaxed": the commit is handed to the operating system without waiting for the disk flush
 * (IndexedDB 3.0 durability hint). A crashed tab or browser still keeps it; only a power cut in
 * the same instant could lose the last tap. It makes a tap cost milliseconds, not a disk sync.
 */
const RELAXED = { durability: "relaxed" } as const;

// Every change to a sweep's readings goes through these functions, which write IndexedDB in one
// transaction each. The sync queue later reads the state they leave (reading-sync.ts) and sends
// the changes.

export async function saveSweep(db: WalkDb, sweep: LocalSweep): Promise<void> {
  await db.put("sweeps", sweep);
}

export async function getLocalSweep(db: WalkDb, id: string): Promise<LocalSweep | undefined> {
  return db.get("sweeps", id);
}

/** Drops a reading at a tap. With `draft`, it waits for the keypad before it may be uploaded. */
export async function addReading(
  db: WalkDb,
  sweepId: string,
  values: ReadingValues,
  options: { id?: string; draft?: boolean; passId?: string | null } = {},
): Promise<LocalReading> {
  // One transaction for the counter and the reading: a tap costs a single IndexedDB commit.
  const tx = db.transaction(["readings", "meta"], "readwrite", RELAXED);
  const seq = ((await tx.objectStore("meta").get("seq")) ?? 0) + 1;
  const reading: LocalReading = {
    id: options.id ?? crypto.randomUUID(),
    sweepId,
    seq,
    ...values,
    passId: options.passId ?? null,
    sync: options.draft ? DRAFT : QUEUED_NEW,
  };
  await tx.objectStore("meta").put(seq, "seq");
  await tx.objectStore("readings").put(reading);
  await tx.done;
  return reading;
}

/** Changes a reading's values (the keypad's confirmation, an edit, or a fix of a rejected one). */
export async function updateReading(
  db: WalkDb,
  id: string,
  values: Partial<ReadingValues>,
  options: { commit?: boolean } = {},
): Promise<LocalReading | undefined> {
  const tx = db.transaction("readings", "readwrite", RELAXED);
  const r = await tx.store.get(id);
  if (!r) return undefined;
  // On the server already: the change travels as an edit (audited there). Not yet: the upload
  // carries the new values. A refused one is queued again.
  const next: LocalReading = {
    ...r,
    ...values,
    sync: afterValuesChange(r.sync, options.commit ?? false, new Date().toISOString()),
  };
  await tx.store.put(next);
  await tx.done;
  return next;
}

/**
 * What the keypad shows on the open reading, kept on the device as it is typed so a reload brings it
 * back. Only while the reading is still open: once committed (next tap, Save, Submit, leaving the
 * screen), a late keystroke must never change it behind the technician's back.
 */
export async function keepDraftValues(
  db: WalkDb,
  id: string,
  values: Partial<ReadingValues>,
): Promise<LocalReading | undefined> {
  const tx = db.transaction("readings", "readwrite", RELAXED);
  const r = await tx.store.get(id);
  if (!r || r.sync.kind !== "draft") return undefined;
  const next: LocalReading = { ...r, ...values };
  await tx.store.put(next);
  await tx.done;
  return next;
}

/** Commits every open reading of a sweep as it stands on the device (before a submit). */
export async function commitDrafts(db: WalkDb, sweepId: string): Promise<number> {
  const tx = db.transaction("readings", "readwrite", RELAXED);
  const open = (await tx.store.index("bySync").getAll("draft")).filter((r) => r.sweepId === sweepId);
  await Promise.all(open.map((r) => tx.store.put({ ...r, sync: QUEUED_NEW })));
  await tx.done;
  return open.length;
}

/** Undo or delete: a reading the server never saw just goes; one it has waits for its delete. */
export async function removeReading(db: WalkDb, id: string): Promise<void> {
  const tx = db.transaction("readings", "readwrite");
  const r = await tx.store.get(id);
  if (!r) return;
  const next = afterRemove(r.sync, new Date().toISOString());
  if (next) await tx.store.put({ ...r, sync: next });
  else await tx.store.delete(id);
  await tx.done;
}

/** The sweep's readings in tap order, without those waiting to be deleted. */
export async function sweepReadings(db: WalkDb, sweepId: string): Promise<LocalReading[]> {
  const range = IDBKeyRange.bound([sweepId, -Infinity], [sweepId, Infinity]);
  const all = await db.getAllFromIndex("readings", "bySweepSeq", range);
  return all.filter((r) => !isDeleted(r.sync));
}

/** Every sweep on the device; for those in progress, how many readings they hold and how many wait. */
export async function sweepSummaries(db: WalkDb): Promise<LocalSweepSummary[]> {
  const out: LocalSweepSummary[] = [];
  for (const sweep of await db.getAll("sweeps")) {
    let readings = 0;
    let waiting = 0;
    if (sweep.status === "in-progress")
      for (const r of await db.getAllFromIndex("readings", "bySweep", sweep.id)) {
        if (isDeleted(r.sync)) continue;
        readings++;
        if (r.sync.kind === "draft" || isQueued(r.sync)) waiting++;
      }
    out.push({ sweep, readings, waiting });
  }
  return out;
}

/** What the banner counts: changes (readings, sweeps, findings) not yet on the server; rejected ones apart. */
export async function queueCounts(db: WalkDb): Promise<{ waiting: number; rejected: number }> {
  let waiting = await db.countFromIndex("readings", "bySync", IDBKeyRange.bound(...QUEUED_RANGE));
  const rejected = await db.countFromIndex("readings", "bySync", "refused");
  for (const s of await db.getAll("sweeps")) if (sweepWaits(s.sync)) waiting++;
  const leaks = await findingCounts(db);
  return { waiting: waiting + leaks.waiting, rejected: rejected + leaks.rejected };
}
