import "fake-indexeddb/auto";
import { beforeEach, describe, expect, it } from "vitest";
import type { CreateFindingInput } from "#core/contracts/findings";
import type {
  CreateSweepInput,
  ReadingEditInput,
  ReadingInput,
  ReadingsBatchResult,
  SweepPassInput,
} from "#core/contracts/sweeps";
import type { LocalSweep } from "./local-types";
import { discardFinding, queueFinding } from "./finding-queue";
import {
  addReading,
  commitDrafts,
  keepDraftValues,
  queueCounts,
  removeReading,
  saveSweep,
  sweepReadings,
  updateReading,
} from "./reading-store";
import { syncOnce } from "./sync-queue";
import { RefusedError, type SyncTransport } from "./sync-transport";
import { openWalkDb, type WalkDb } from "./walk-db";

/**
 * A stand-in for the server's side of the contract (the real one is tested in
 * server/api/sweeps/sweeps.test.ts against PostgreSQL): it stores by id once, rejects negative
 * ppm per reading, and can drop the connection after storing, as a server that stored a batch
 * but whose answer was lost would.
 */
class FakeServer implements SyncTransport {
  sweeps = new Set<string>();
  readings = new Map<string, ReadingInput>();
  order: string[] = [];
  deletes: string[] = [];
  edits: Array<{ id: string; body: ReadingEditInput }> = [];
  submitted: string[] = [];
  offline = false;
  loseAnswerOnce = false;
  batchSizes: number[] = [];

  private check() {
    if (this.offline) throw new Error("network");
  }
  refuseSweeps = new Set<string>();
  async createSweep(_storeId: string, body: CreateSweepInput) {
    this.check();
    if (this.refuseSweeps.has(body.id!))
      throw new RefusedError(400, "Please check: planId is not calibrated yet.", { planId: "is not calibrated yet" });
    this.sweeps.add(body.id!);
  }
  passes = new Map<string, SweepPassInput & { sweepId: string }>();
  async savePass(sweepId: string, passId: string, body: SweepPassInput) {
    this.check();
    if (!this.sweeps.has(sweepId)) throw new RefusedError(404, "That sweep was not found.", {});
    if (body.fixtureId === BAD_FIXTURE)
      throw new RefusedError(400, "Please check: fixtureId.", { fixtureId: "is not a fixture of the sweep's plan" });
    this.passes.set(passId, { ...this.passes.get(passId), ...body, sweepId });
  }
  async uploadReadings(sweepId: string, list: ReadingInput[]): Promise<ReadingsBatchResult> {
    this.check();
    if (!this.sweeps.has(sweepId)) throw new RefusedError(404, "That sweep was not found.", {});
    this.batchSizes.push(list.length);
    const result: ReadingsBatchResult = { stored: [], duplicates: [], rejected: [], readingsRevision: 0 };
    list.forEach((r, index) => {
      if (r.ppm < 0) result.rejected.push({ index, id: r.id, reasons: { ppm: "must be 0 ppm or more" } });
      else if (r.passId && !this.passes.has(r.passId))
        result.rejected.push({ index, id: r.id, reasons: { passId: "is not a pass of this sweep" } });
      else if (this.readings.has(r.id)) result.duplicates.push(r.id);
      else {
        this.readings.set(r.id, r);
        this.order.push(r.id);
        result.stored.push(r.id);
      }
    });
    if (this.loseAnswerOnce) {
      this.loseAnswerOnce = false;
      throw new Error("connection reset after the server stored the batch");
    }
    return result;
  }
  async editReading(_sweepId: string, id: string, body: ReadingEditInput) {
    this.check();
    this.edits.push({ id, body });
  }
  async deleteReading(_sweepId: string, id: string) {
    this.check();
    this.deletes.push(id);
  }
  async submitSweep(id: string) {
    this.check();
    this.submitted.push(id);
  }
  /** By clientId, as the server's unique (company, client_id) makes it. */
  findings = new Map<string, { id: string; input: CreateFindingInput; photos: string[] }>();
  losePhotoAnswerOnce = false;
  async createFinding(_storeId: string, input: CreateFindingInput) {
    this.check();
    if (input.status === "confirmed" && !input.component)
      throw new RefusedError(400, "Please check: component is required.", {
        component: "is required when the leak is confirmed",
      });
    let f = this.findings.get(input.clientId!);
    if (!f) this.findings.set(input.clientId!, (f = { id: crypto.randomUUID(), input, photos: [] }));
    return { id: f.id, photoCount: f.photos.length };
  }
  async addFindingPhoto(findingId: string, photo: { name: string }) {
    this.check();
    [...this.findings.values()].find((f) => f.id === findingId)!.photos.push(photo.name);
    if (this.losePhotoAnswerOnce) {
      this.losePhotoAnswerOnce = false;
      throw new Error("connection reset after the server stored the photo");
    }
  }
}

let db: WalkDb;
let server: FakeServer;
let n = 0;
const sweep: LocalSweep = {
  id: "6f1c1e52-1d7b-4b83-9a8e-3c2d1f0e9b7a",
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
  sync: { kind: "queued-new", thenSubmit: false },
  passes: [],
};
/** A fixture id the fake server refuses for a pass. */
const BAD_FIXTURE = "0b5d1a3e-2c4f-4e6a-8b7c-9d0e1f2a3b4c";
const values = (i: number, ppm = 0) => ({
  x: i,
  y: 2,
  takenAt: new Date(Date.parse(sweep.startedAt) + i * 3000).toISOString(),
  ppm,
  atLeast: false,
  samplePoint: "grille" as const,
  note: "",
});

beforeEach(async () => {
  db = await openWalkDb(`walk-test-${++n}`);
  server = new FakeServer();
  await saveSweep(db, sweep);
});

describe("the sync queue", () => {
  it("uploads a sweep's readings in tap order and counts nothing waiting afterwards", async () => {
    for (let i = 0; i < 10; i++) await addReading(db, sweep.id, values(i));
    expect(await queueCounts(db)).toEqual({ waiting: 11, rejected: 0 }); // 10 readings + the sweep
    const report = await syncOnce(db, server);
    expect(report).toEqual({ confirmed: 10, rejected: 0, submitted: 0, stoppedBy: null });
    expect(server.order).toEqual((await sweepReadings(db, sweep.id)).map((r) => r.id));
    expect(await queueCounts(db)).toEqual({ waiting: 0, rejected: 0 });
  });

  it("keeps everything queued while offline and stores each reading once when an answer was lost", async () => {
    for (let i = 0; i < 5; i++) await addReading(db, sweep.id, values(i));
    server.offline = true;
    expect((await syncOnce(db, server)).stoppedBy).toBe("network");
    expect((await queueCounts(db)).waiting).toBe(6);
    server.offline = false;
    server.loseAnswerOnce = true;
    expect((await syncOnce(db, server)).stoppedBy).toMatch(/connection reset/);
    expect((await queueCounts(db)).waiting).toBe(5); // the sweep made it; the readings' answer was lost
    await syncOnce(db, server);
    expect(server.readings.size).toBe(5);
    expect((await queueCounts(db)).waiting).toBe(0);
  });

  it("leaves a rejected reading on the device with its reasons, uploads the rest, and resends it once fixed", async () => {
    await addReading(db, sweep.id, values(0));
    const bad = await addReading(db, sweep.id, values(1, -3));
    await addReading(db, sweep.id, values(2));
    const report = await syncOnce(db, server);
    expect(report).toMatchObject({ confirmed: 2, rejected: 1 });
    const kept = (await sweepReadings(db, sweep.id)).find((r) => r.id === bad.id)!;
    expect(kept.sync).toEqual({
      kind: "refused",
      change: "new",
      reasons: { ppm: "must be 0 ppm or more" },
      editedAt: null,
    });
    // a later reading is not held up by the rejected one
    await addReading(db, sweep.id, values(3));
    expect((await syncOnce(db, server)).confirmed).toBe(1);
    expect(await queueCounts(db)).toEqual({ waiting: 0, rejected: 1 });
    await updateReading(db, bad.id, { ppm: 3 });
    await syncOnce(db, server);
    expect(server.readings.get(bad.id)?.ppm).toBe(3);
    expect(await queueCounts(db)).toEqual({ waiting: 0, rejected: 0 });
  });

  it("holds a keypad draft back until it is confirmed", async () => {
    const d = await addReading(db, sweep.id, values(0), { draft: true });
    await syncOnce(db, server);
    expect(server.readings.size).toBe(0);
    await updateReading(db, d.id, { ppm: 1.5 }, { commit: true });
    await syncOnce(db, server);
    expect(server.readings.get(d.id)?.ppm).toBe(1.5);
  });

  it("sends edits and deletes of uploaded readings, and a submit only after the readings", async () => {
    const a = await addReading(db, sweep.id, values(0));
    const b = await addReading(db, sweep.id, values(1));
    await syncOnce(db, server);
    await updateReading(db, a.id, { ppm: 4, note: "re-read" });
    await removeReading(db, b.id);
    expect((await sweepReadings(db, sweep.id)).map((r) => r.id)).toEqual([a.id]);
    await saveSweep(db, { ...(await db.get("sweeps", sweep.id))!, sync: { kind: "queued-submit" } });
    await addReading(db, sweep.id, values(2));
    await syncOnce(db, server);
    expect(server.edits).toMatchObject([{ id: a.id, body: { ppm: 4, note: "re-read" } }]);
    expect(server.deletes).toEqual([b.id]);
    expect(server.readings.size).toBe(3);
    expect(server.submitted).toEqual([sweep.id]);
    expect(await db.get("sweeps", sweep.id)).toMatchObject({ status: "submitted", sync: { kind: "on-server" } });
    expect(await db.get("readings", b.id)).toBeUndefined();
  });

  it("undoes a reading the server never saw without sending anything", async () => {
    const a = await addReading(db, sweep.id, values(0));
    await removeReading(db, a.id);
    await syncOnce(db, server);
    expect(server.readings.size).toBe(0);
    expect(server.deletes).toEqual([]);
  });

  it("splits a long queue into batches of at most the batch size", async () => {
    for (let i = 0; i < 7; i++) await addReading(db, sweep.id, values(i));
    await syncOnce(db, server, 3);
    expect(server.batchSizes).toEqual([3, 3, 1]);
  });

  it("keeps a sweep the server refused, with its reason, and still uploads another sweep's readings", async () => {
    const other = { ...sweep, id: "0d7e2c4a-5b6f-4a1e-9c3d-8b7a6f5e4d3c" };
    await saveSweep(db, other);
    server.refuseSweeps.add(sweep.id);
    await addReading(db, sweep.id, values(0));
    await addReading(db, other.id, values(1));
    const report = await syncOnce(db, server);
    expect(report).toMatchObject({ confirmed: 1, stoppedBy: null });
    expect((await db.get("sweeps", sweep.id))?.sync).toEqual({
      kind: "refused",
      reasons: { planId: "is not calibrated yet" },
      thenSubmit: false,
    });
    expect([...server.readings.keys()]).toHaveLength(1);
    expect((await sweepReadings(db, sweep.id))[0].sync).toEqual({ kind: "queued-new" }); // still on the device
  });

  it("keeps a reading open on the keypad off the server, lets typing change only the open one, and holds the submit until it is committed", async () => {
    const a = await addReading(db, sweep.id, values(0), { draft: true });
    await keepDraftValues(db, a.id, { ppm: 7 });
    await saveSweep(db, { ...(await db.get("sweeps", sweep.id))!, sync: { kind: "queued-new", thenSubmit: true } });
    await syncOnce(db, server);
    expect(server.readings.size).toBe(0);
    expect(server.submitted).toEqual([]); // the open reading belongs to the sweep
    expect((await db.get("readings", a.id))?.ppm).toBe(7); // what was typed survives a reload
    expect(await commitDrafts(db, sweep.id)).toBe(1);
    await syncOnce(db, server);
    expect(server.readings.get(a.id)?.ppm).toBe(7);
    expect(server.submitted).toEqual([sweep.id]);
    // a keystroke that arrives after the commit must not change the uploaded value
    expect(await keepDraftValues(db, a.id, { ppm: 70 })).toBeUndefined();
    expect((await db.get("readings", a.id))?.ppm).toBe(7);
    await syncOnce(db, server);
    expect(server.edits).toEqual([]);
  });

  it("sends a moved reading's new position as an edit", async () => {
    const a = await addReading(db, sweep.id, values(3));
    await syncOnce(db, server);
    await updateReading(db, a.id, { x: 3.4, y: 2.6 }, { commit: true });
    expect(await queueCounts(db)).toEqual({ waiting: 1, rejected: 0 });
    await syncOnce(db, server);
    expect(server.edits).toMatchObject([{ id: a.id, body: { x: 3.4, y: 2.6, ppm: 0 } }]);
    expect(await queueCounts(db)).toEqual({ waiting: 0, rejected: 0 });
  });

  const leak = (clientId: string, extra: Partial<Omit<CreateFindingInput, "sweepId">> = {}) => ({
    sweepId: sweep.id,
    clientId,
    source: "walk" as const,
    status: "confirmed" as const,
    component: "brazed-joint" as const,
    planId: "p",
    x: 4,
    y: 2,
    note: "",
    ...extra,
  });
  const photo = { name: "joint.jpg", type: "image/jpeg", data: new Uint8Array([0xff, 0xd8, 0xff, 0xd9]).buffer };

  it("queues a leak marked offline with its photo, counts it as waiting, and stores it and its photo once despite lost answers", async () => {
    server.offline = true;
    const id = crypto.randomUUID();
    await queueFinding(db, "s", leak(id), photo);
    expect(await queueCounts(db)).toEqual({ waiting: 2, rejected: 0 }); // the sweep and the finding
    expect((await syncOnce(db, server)).stoppedBy).toBe("network");
    expect((await db.get("findings", id))?.photo?.data.byteLength).toBe(4); // the photo is on the device
    server.offline = false;
    server.losePhotoAnswerOnce = true;
    expect((await syncOnce(db, server)).stoppedBy).toMatch(/photo/);
    expect((await queueCounts(db)).waiting).toBe(1);
    await syncOnce(db, server);
    expect(server.findings.size).toBe(1);
    expect(server.findings.get(id)?.photos).toEqual(["joint.jpg"]);
    expect(await queueCounts(db)).toEqual({ waiting: 0, rejected: 0 });
  });

  it("holds a finding until its sweep is on the server, and keeps a refused one with its reasons", async () => {
    server.refuseSweeps.add(sweep.id);
    const held = crypto.randomUUID();
    await queueFinding(db, "s", leak(held), null);
    await syncOnce(db, server);
    expect(server.findings.size).toBe(0);
    expect((await db.get("findings", held))?.state).toBe("pending");
    server.refuseSweeps.clear();
    await saveSweep(db, { ...(await db.get("sweeps", sweep.id))!, sync: { kind: "queued-new", thenSubmit: false } });
    const bad = crypto.randomUUID();
    await queueFinding(db, "s", leak(bad, { component: null }), null);
    const report = await syncOnce(db, server);
    expect(report).toMatchObject({ confirmed: 1, rejected: 1, stoppedBy: null });
    expect(await db.get("findings", bad)).toMatchObject({
      state: "rejected",
      reasons: { component: "is required when the leak is confirmed" },
    });
    expect(await queueCounts(db)).toEqual({ waiting: 0, rejected: 1 });
    await discardFinding(db, bad);
    expect(await queueCounts(db)).toEqual({ waiting: 0, rejected: 0 });
  });
});

describe("the sync queue with pinpoint passes", () => {
  it("holds a refused pass with its reasons and still sends the other readings; the pass's readings come back refused by field", async () => {
    await saveSweep(db, {
      ...sweep,
      passes: [
        {
          id: "bad-pass",
          fans: "stopped",
          defrost: false,
          fixtureId: BAD_FIXTURE,
          startedAt: values(5).takenAt,
          endedAt: null,
          restoreAfterMin: 20,
          sync: { kind: "queued" },
        },
      ],
    });
    const plain = await addReading(db, sweep.id, values(1));
    const inPass = await addReading(db, sweep.id, values(6), { passId: "bad-pass" });
    const report = await syncOnce(db, server);
    expect(report.stoppedBy).toBeNull();
    expect(server.readings.has(plain.id)).toBe(true);
    // the fake server knows no such pass: the reading is refused alone, as the real one does by field
    expect(server.readings.has(inPass.id)).toBe(false);
    expect((await db.get("sweeps", sweep.id))!.passes[0].sync).toEqual({
      kind: "refused",
      reasons: { fixtureId: "is not a fixture of the sweep's plan" },
    });
    const left = (await sweepReadings(db, sweep.id)).find((r) => r.id === inPass.id)!;
    expect(left.sync).toMatchObject({ kind: "refused", reasons: { passId: "is not a pass of this sweep" } });
    // a second pass of the queue sends nothing more: nothing is stuck, nothing is lost
    expect(await syncOnce(db, server)).toMatchObject({ confirmed: 0, stoppedBy: null });
  });
});
