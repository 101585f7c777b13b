import { openDB, type DBSchema, type IDBPDatabase, type IDBPTransaction, type StoreNames } from "idb";
import type { LocalFinding, LocalReading, LocalSweep } from "./local-types";
import { syncFromLegacy, type LegacyReadingFlags } from "./reading-sync";
import { sweepSyncFromLegacy, type LegacySweepFlags } from "./sweep-sync";

// The device's own copy of everything a sweep needs. Readings land here before any upload, so a
// reload, a lost connection, a server restart or a crashed tab loses nothing.

export interface WalkDbSchema extends DBSchema {
  sweeps: { key: string; value: LocalSweep };
  readings: {
    key: string;
    value: LocalReading;
    /** bySync: the kind of `sync` (draft, queued-new, …): the queue reads only what waits. */
    indexes: { bySweep: string; bySweepSeq: [string, number]; bySync: string };
  };
  /** Plan, fixtures, image, detectors, systems of a store: cached whenever a store is opened. */
  cache: { key: string; value: { key: string; value: unknown; savedAt: string } };
  meta: { key: string; value: number };
  /** Pinpointed leaks waiting for the server (with their photos). */
  findings: { key: string; value: LocalFinding };
}

export type WalkDb = IDBPDatabase<WalkDbSchema>;

export const WALK_DB_NAME = "plumeline-walk";

export function openWalkDb(name = WALK_DB_NAME, factory?: IDBFactory): Promise<WalkDb> {
  const previous = globalThis.indexedDB;
  // idb opens with the global factory; tests pass fake-indexeddb's.
  if (factory) (globalThis as { indexedDB: IDBFactory }).indexedDB = factory;
  try {
    return openDB<WalkDbSchema>(name, WALK_DB_VERSION, {
      async upgrade(db, oldVersion, _newVersion, tx) {
        if (oldVersion < 1) {
          db.createObjectStore("sweeps", { keyPath: "id" });
          const readings = db.createObjectStore("readings", { keyPath: "id" });
          readings.createIndex("bySweep", "sweepId");
          readings.createIndex("bySweepSeq", ["sweepId", "seq"]);
          db.createObjectStore("cache", { keyPath: "key" });
          db.createObjectStore("meta");
        }
        // Version 2 indexed the old `state` flag; version 4 replaces it by the `sync` union.
        if (oldVersion < 3) db.createObjectStore("findings", { keyPath: "clientId" });
        if (oldVersion < 4) await toSyncUnion(tx, oldVersion);
        if (oldVersion < 5) await toPasses(tx);
      },
    });
  } finally {
    if (factory) (globalThis as { indexedDB: IDBFactory }).indexedDB = previous;
  }
}

/**
 * 4: a reading's and a sweep's sync state became one union each (reading-sync.ts, sweep-sync.ts).
 * 5: a sweep holds its pinpoint passes and a reading the pass it was taken in (pinpoint-pass.ts).
 */
export const WALK_DB_VERSION = 5;

type UpgradeTx = IDBPTransaction<WalkDbSchema, StoreNames<WalkDbSchema>[], "versionchange">;

/**
 * Converts what a device already holds from the old flags (draft, state, onServer, editPending,
 * deletePending, reasons; onServer, submitPending, rejected) into the unions, in the upgrade's own
 * transaction: a reading waiting to upload before the app update still waits after it.
 */
async function toSyncUnion(tx: UpgradeTx, oldVersion: number): Promise<void> {
  const now = new Date().toISOString();
  const readings = tx.objectStore("readings");
  // The old index is typed out of the schema now; the store still has it on devices at version 2 or 3.
  const untyped = readings as unknown as { indexNames: DOMStringList; deleteIndex(name: string): void };
  if (oldVersion >= 2 && untyped.indexNames.contains("byState")) untyped.deleteIndex("byState");
  readings.createIndex("bySync", "sync.kind");
  for (let c = await readings.openCursor(); c; c = await c.continue()) {
    const old = c.value as LocalReading & LegacyReadingFlags;
    if (old.sync) continue;
    const { draft, state, onServer, editPending, deletePending, editedAt, reasons, ...rest } = old;
    await c.update({
      ...rest,
      sync: syncFromLegacy({ draft, state, onServer, editPending, deletePending, editedAt, reasons }, now),
    });
  }
  const sweeps = tx.objectStore("sweeps");
  for (let c = await sweeps.openCursor(); c; c = await c.continue()) {
    const old = c.value as LocalSweep & LegacySweepFlags;
    if (old.sync) continue;
    const { onServer, submitPending, rejected, ...rest } = old;
    await c.update({ ...rest, sync: sweepSyncFromLegacy({ onServer, submitPending, rejected }) });
  }
}

/**
 * Every sweep and reading already on the device was taken before passes existed: the sweep has none and
 * each reading belongs to its first pass (null), in the upgrade's own transaction as for version 4.
 */
async function toPasses(tx: UpgradeTx): Promise<void> {
  const sweeps = tx.objectStore("sweeps");
  for (let c = await sweeps.openCursor(); c; c = await c.continue()) {
    if (!Array.isArray(c.value.passes)) await c.update({ ...c.value, passes: [] });
  }
  const readings = tx.objectStore("readings");
  for (let c = await readings.openCursor(); c; c = await c.continue()) {
    if (c.value.passId === undefined) await c.update({ ...c.value, passId: null });
  }
}

let shared: Promise<WalkDb> | null = null;

/** The app's one connection. */
export function walkDb(): Promise<WalkDb> {
  shared ??= openWalkDb();
  return shared;
}
