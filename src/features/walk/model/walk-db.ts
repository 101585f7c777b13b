import { openDB, type DBSchema, type IDBPDatabase } from "idb";
import type { LocalFinding, LocalReading, LocalSweep } from "./local-types";

// The device's own copy of everything a sweep needs. Readings land here before any upload, so a
// reload, a lost connection, a server restart or a crashed tab loses nothing.

export interface WalkDbSchema extends DBSchema {
  sweeps: { key: string; value: LocalSweep };
  readings: {
    key: string;
    value: LocalReading;
    indexes: { bySweep: string; bySweepSeq: [string, number]; byState: string };
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
    return openDB<WalkDbSchema>(name, 3, {
      upgrade(db, oldVersion, _newVersion, tx) {
        if (oldVersion < 1) {
          db.createObjectStore("sweeps", { keyPath: "id" });
          const readings = db.createObjectStore("readings", { keyPath: "id" });
          readings.createIndex("bySweep", "sweepId");
          readings.createIndex("bySweepSeq", ["sweepId", "seq"]);
          db.createObjectStore("cache", { keyPath: "key" });
          db.createObjectStore("meta");
        }
        // The queue reads only what waits, not the whole sweep, on every pass.
        if (oldVersion < 2) tx.objectStore("readings").createIndex("byState", "state");
        if (oldVersion < 3) db.createObjectStore("findings", { keyPath: "clientId" });
      },
    });
  } finally {
    if (factory) (globalThis as { indexedDB: IDBFactory }).indexedDB = previous;
  }
}

let shared: Promise<WalkDb> | null = null;

/** The app's one connection. */
export function walkDb(): Promise<WalkDb> {
  shared ??= openWalkDb();
  return shared;
}
