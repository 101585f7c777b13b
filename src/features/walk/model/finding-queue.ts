import type { CreateFindingInput } from "#core/contracts/findings";
import type { LocalFinding } from "./local-types";
import { RefusedError, type SyncTransport } from "./sync-transport";
import type { WalkDb } from "./walk-db";

/**
 * "Leak here" writes the finding to the device first, like a reading; the sync pass sends it once
 * its sweep is on the server. A finding is done when the server has it and, if there is one, its
 * photo: the create is idempotent by client id and answers with the photos already stored, so a
 * photo whose answer was lost is not sent twice.
 */
export async function queueFinding(
  db: WalkDb,
  storeId: string,
  input: CreateFindingInput & { clientId: string; sweepId: string },
  photo: { name: string; type: string; data: ArrayBuffer } | null,
): Promise<LocalFinding> {
  const f: LocalFinding = {
    clientId: input.clientId,
    storeId,
    sweepId: input.sweepId,
    input,
    photo,
    state: "pending",
    findingId: null,
    reasons: null,
  };
  await db.put("findings", f);
  return f;
}

export async function findingCounts(db: WalkDb): Promise<{ waiting: number; rejected: number }> {
  const all = await db.getAll("findings");
  return {
    waiting: all.filter((f) => f.state === "pending").length,
    rejected: all.filter((f) => f.state === "rejected").length,
  };
}

function reasonsOf(e: RefusedError): Record<string, string> {
  return Object.keys(e.fields).length ? e.fields : { "": e.message };
}

/** Sends the waiting findings of sweeps the server has. Throws on a lost connection (the pass stops). */
export async function syncFindings(
  db: WalkDb,
  transport: SyncTransport,
  onServer: (sweepId: string) => boolean,
): Promise<{ confirmed: number; rejected: number }> {
  const out = { confirmed: 0, rejected: 0 };
  for (const f of await db.getAll("findings")) {
    if (f.state !== "pending" || !onServer(f.sweepId)) continue;
    try {
      const stored = await transport.createFinding(f.storeId, f.input);
      if (f.photo && stored.photoCount === 0) {
        await db.put("findings", { ...f, findingId: stored.id });
        await transport.addFindingPhoto(stored.id, f.photo);
      }
      await db.delete("findings", f.clientId);
      out.confirmed++;
    } catch (e) {
      if (!(e instanceof RefusedError) || e.status === 401) throw e;
      out.rejected++;
      await db.put("findings", { ...f, state: "rejected", reasons: reasonsOf(e) });
    }
  }
  return out;
}

/** A refused finding the technician gives up on (after reading why). */
export async function discardFinding(db: WalkDb, clientId: string): Promise<void> {
  await db.delete("findings", clientId);
}
