import "fake-indexeddb/auto";
import { openDB } from "idb";
import { describe, expect, it } from "vitest";
import type { ReadingInput, SweepPassInput } from "#core/contracts/sweeps";
import { endPass, startPass } from "./pinpoint-pass";
import { addReading, getLocalSweep, queueCounts, saveSweep, sweepReadings } from "./reading-store";
import { syncOnce } from "./sync-queue";
import type { SyncTransport } from "./sync-transport";
import { openWalkDb, WALK_DB_VERSION } from "./walk-db";

// A phone that ran the app before pinpoint passes holds sweeps without passes and readings without a
// pass (database version 4). The version 5 upgrade gives every sweep an empty list of passes and every
// reading the first pass, and what waited to upload still waits.
const SWEEP = "6f1c1e52-1d7b-4b83-9a8e-3c2d1f0e9b7a";
const at = (s: number) => new Date(Date.parse("2026-11-02T14:00:00.000Z") + s * 1000).toISOString();
const values = (i: number) => ({
  x: i,
  y: 2,
  takenAt: at(i * 3),
  ppm: i,
  atLeast: false,
  samplePoint: "grille" as const,
  note: "",
});

/** Version 4 as the previous app version created it, with rows as it wrote them. */
async function version4Device(name: string) {
  const db = await openDB(name, 4, {
    upgrade(d) {
      d.createObjectStore("sweeps", { keyPath: "id" });
      const readings = d.createObjectStore("readings", { keyPath: "id" });
      readings.createIndex("bySweep", "sweepId");
      readings.createIndex("bySweepSeq", ["sweepId", "seq"]);
      readings.createIndex("bySync", "sync.kind");
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
    startedAt: at(0),
    status: "in-progress",
    transportDelayS: 5,
    timeConstantS: 1.5,
    alarmPpm: 2,
    warnings: [],
    sync: { kind: "on-server" },
  });
  await db.put("readings", { id: "synced", sweepId: SWEEP, seq: 1, ...values(0), sync: { kind: "synced" } });
  await db.put("readings", { id: "waiting", sweepId: SWEEP, seq: 2, ...values(1), sync: { kind: "queued-new" } });
  await db.put("meta", 2, "seq");
  db.close();
}

class Recorder implements SyncTransport {
  calls: string[] = [];
  uploads: ReadingInput[] = [];
  passes: (SweepPassInput & { id: string })[] = [];
  async createSweep() {}
  async savePass(_s: string, id: string, body: SweepPassInput) {
    this.calls.push(`pass ${id}`);
    this.passes.push({ id, ...body });
  }
  async uploadReadings(_s: string, list: ReadingInput[]) {
    this.calls.push(`readings ${list.map((r) => r.id).join(",")}`);
    this.uploads.push(...list);
    return { stored: list.map((r) => r.id), duplicates: [], rejected: [], readingsRevision: 1 };
  }
  async editReading() {}
  async deleteReading() {}
  async submitSweep() {}
  async createFinding() {
    return { id: "f", photoCount: 0 };
  }
  async addFindingPhoto() {}
}

describe("the walk database's version 5 upgrade (pinpoint passes)", () => {
  it("puts what the device held in the first pass and sends the waiting reading as an old client did", async () => {
    await version4Device("walk-passes-1");
    const db = await openWalkDb("walk-passes-1");
    expect(db.version).toBe(WALK_DB_VERSION);
    expect(WALK_DB_VERSION).toBe(5);
    expect((await getLocalSweep(db, SWEEP))?.passes).toEqual([]);
    expect((await sweepReadings(db, SWEEP)).map((r) => [r.id, r.passId])).toEqual([
      ["synced", null],
      ["waiting", null],
    ]);
    expect(await queueCounts(db)).toEqual({ waiting: 1, rejected: 0 });
    const server = new Recorder();
    expect((await syncOnce(db, server)).stoppedBy).toBeNull();
    // no pass to send, and the reading goes without a pass field: what a server before passes accepts
    expect(server.calls).toEqual(["readings waiting"]);
    expect(Object.keys(server.uploads[0])).not.toContain("passId");
    db.close();
  });

  it("sends a pass before the readings that name it, and its end later", async () => {
    await version4Device("walk-passes-2");
    const db = await openWalkDb("walk-passes-2");
    const sweep = (await getLocalSweep(db, SWEEP))!;
    const started = startPass(sweep, { condition: "fans-stopped", fixtureId: null }, "pass-2", at(600));
    await saveSweep(db, started);
    const inPass = await addReading(db, SWEEP, values(201), { passId: "pass-2" });
    const server = new Recorder();
    await syncOnce(db, server);
    expect(server.calls).toEqual(["pass pass-2", `readings waiting,${inPass.id}`]);
    expect(server.uploads.map((r) => r.passId ?? null)).toEqual([null, "pass-2"]);
    expect(server.passes[0]).toMatchObject({ fans: "stopped", defrost: false, startedAt: at(600), endedAt: null });
    expect((await getLocalSweep(db, SWEEP))!.passes[0].sync).toEqual({ kind: "on-server" });
    // the pass ends: only its end travels, once
    await saveSweep(db, endPass((await getLocalSweep(db, SWEEP))!, at(1500)));
    server.calls = [];
    await syncOnce(db, server);
    await syncOnce(db, server);
    expect(server.calls).toEqual(["pass pass-2"]);
    expect(server.passes[1]).toMatchObject({ endedAt: at(1500) });
    db.close();
  });
});
