import "fake-indexeddb/auto";
import { openDB } from "idb";
import { describe, expect, it } from "vitest";
import { queueCounts, sweepReadings } from "./reading-store";
import { syncOnce } from "./sync-queue";
import type { SyncTransport } from "./sync-transport";
import { openWalkDb, WALK_DB_VERSION } from "./walk-db";

// A phone that ran the previous app version holds readings with the old flags (database version
// 3). The version 4 upgrade must carry every one over: what waited still waits, what was refused
// keeps its reasons, what was on the keypad is still open.
const SWEEP = "6f1c1e52-1d7b-4b83-9a8e-3c2d1f0e9b7a";
const values = (i: number) => ({
  sweepId: SWEEP,
  seq: i + 1,
  x: i,
  y: 2,
  takenAt: new Date(Date.parse("2026-11-02T14:00:00.000Z") + i * 3000).toISOString(),
  ppm: i,
  atLeast: false,
  samplePoint: "grille",
  note: "",
});
const legacy = {
  draft: false,
  onServer: false,
  editPending: false,
  deletePending: false,
  editedAt: null,
  reasons: null,
};

/** Version 3 as the previous app version created it, with rows as it wrote them. */
async function version3Device(name: string) {
  const db = await openDB(name, 3, {
    upgrade(d) {
      d.createObjectStore("sweeps", { keyPath: "id" });
      const readings = d.createObjectStore("readings", { keyPath: "id" });
      readings.createIndex("bySweep", "sweepId");
      readings.createIndex("bySweepSeq", ["sweepId", "seq"]);
      readings.createIndex("byState", "state");
      d.createObjectStore("cache", { keyPath: "key" });
      d.createObjectStore("meta");
      d.createObjectStore("findings", { keyPath: "clientId" });
    },
  });
  await db.put("sweeps", {
    id: SWEEP,
    storeId: "s",
    planId: "p",
    detectorId: "d",
    detectorName: "Diode",
    systemIds: [],
    fans: "running",
    defrost: false,
    startedAt: "2026-11-02T14:00:00.000Z",
    status: "in-progress",
    transportDelayS: 5,
    timeConstantS: 1.5,
    alarmPpm: 2,
    warnings: [],
    onServer: true,
    submitPending: false,
    rejected: null,
  });
  const rows = [
    { id: "synced", ...values(0), ...legacy, state: "synced", onServer: true },
    { id: "waiting", ...values(1), ...legacy, state: "pending" },
    {
      id: "edited",
      ...values(2),
      ...legacy,
      state: "pending",
      onServer: true,
      editPending: true,
      editedAt: "2026-11-02T14:09:00.000Z",
    },
    {
      id: "deleted",
      ...values(3),
      ...legacy,
      state: "pending",
      onServer: true,
      deletePending: true,
      editedAt: "2026-11-02T14:10:00.000Z",
    },
    { id: "refused", ...values(4), ...legacy, state: "rejected", reasons: { ppm: "must be 0 ppm or more" } },
    { id: "open", ...values(5), ...legacy, state: "draft", draft: true },
  ];
  for (const r of rows) await db.put("readings", r);
  db.close();
}

class Recorder implements SyncTransport {
  uploads: string[] = [];
  edits: string[] = [];
  deletes: string[] = [];
  async createSweep() {}
  async savePass() {}
  async uploadReadings(_s: string, list: { id?: string }[]) {
    this.uploads.push(...list.map((r) => r.id!));
    return { stored: list.map((r) => r.id!), duplicates: [], rejected: [], readingsRevision: 1 };
  }
  async editReading(_s: string, id: string) {
    this.edits.push(id);
  }
  async deleteReading(_s: string, id: string) {
    this.deletes.push(id);
  }
  async submitSweep() {}
  async createFinding() {
    return { id: "f", photoCount: 0 };
  }
  async addFindingPhoto() {}
}

describe("the walk database's version 4 upgrade", () => {
  it("carries readings and sweeps saved with the old flags into the sync unions, and the queue sends what waited", async () => {
    await version3Device("walk-upgrade-1");
    const db = await openWalkDb("walk-upgrade-1");
    expect(db.version).toBe(WALK_DB_VERSION);
    expect([...db.transaction("readings").store.indexNames]).toEqual(["bySweep", "bySweepSeq", "bySync"]);
    const byId = Object.fromEntries((await db.getAll("readings")).map((r) => [r.id, r]));
    expect(byId.synced.sync).toEqual({ kind: "synced" });
    expect(byId.waiting.sync).toEqual({ kind: "queued-new" });
    expect(byId.edited.sync).toEqual({ kind: "queued-edit", editedAt: "2026-11-02T14:09:00.000Z" });
    expect(byId.deleted.sync).toEqual({ kind: "queued-delete", editedAt: "2026-11-02T14:10:00.000Z" });
    expect(byId.refused.sync).toEqual({
      kind: "refused",
      change: "new",
      reasons: { ppm: "must be 0 ppm or more" },
      editedAt: null,
    });
    expect(byId.open.sync).toEqual({ kind: "draft" });
    // The old flags are gone from the rows.
    expect(Object.keys(byId.edited)).not.toContain("editPending");
    expect(Object.keys(byId.edited)).not.toContain("state");
    expect((await db.get("sweeps", SWEEP))?.sync).toEqual({ kind: "on-server" });
    expect(Object.keys((await db.get("sweeps", SWEEP))!)).not.toContain("onServer");

    // What the banner counts and what the queue sends are what waited before the update.
    expect(await queueCounts(db)).toEqual({ waiting: 3, rejected: 1 });
    expect((await sweepReadings(db, SWEEP)).map((r) => r.id)).toEqual([
      "synced",
      "waiting",
      "edited",
      "refused",
      "open",
    ]);
    const server = new Recorder();
    expect((await syncOnce(db, server)).stoppedBy).toBeNull();
    expect(server.uploads).toEqual(["waiting"]);
    expect(server.edits).toEqual(["edited"]);
    expect(server.deletes).toEqual(["deleted"]);
    expect(await queueCounts(db)).toEqual({ waiting: 0, rejected: 1 });
    db.close();
  });

  it("creates the version 4 stores on a new device", async () => {
    const db = await openWalkDb("walk-upgrade-fresh");
    expect([...db.objectStoreNames].sort()).toEqual(["cache", "findings", "meta", "readings", "sweeps"]);
    expect([...db.transaction("readings").store.indexNames]).toEqual(["bySweep", "bySweepSeq", "bySync"]);
    db.close();
  });
});
