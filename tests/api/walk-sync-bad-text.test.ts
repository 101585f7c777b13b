import "fake-indexeddb/auto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { AddressInfo } from "node:net";
import type { Server } from "node:http";
import { eq } from "drizzle-orm";
import { createTestApp, signIn, type TestApp } from "../helpers/test-app";
import { PASSWORD, seedCompany } from "../helpers/fixtures";
import { installBrowserFetch } from "../helpers/node-browser-fetch";
import { detectors, readings } from "../../server/db/schema/index";
import { api } from "../../src/lib/api-client";
import { httpSyncTransport } from "../../src/features/walk/api/sync-api";
import { addReading, queueCounts, saveSweep, sweepReadings } from "../../src/features/walk/model/reading-store";
import { syncOnce } from "../../src/features/walk/model/sync-queue";
import { openWalkDb } from "../../src/features/walk/model/walk-db";

// The technician's offline queue, synced by the Walk client's own code (IndexedDB queue, transport
// and API client) against the real server and PostgreSQL: one reading with a character PostgreSQL
// cannot store must be refused alone, and every other reading must arrive.

let t: TestApp;
let server: Server;
let restoreFetch: () => void;
let co: Awaited<ReturnType<typeof seedCompany>>;
let planId: string;
let detectorId: string;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Kestrel Foods");
  const owner = await signIn(t.app, co.people.owner);
  planId = (await owner.post(`/api/stores/${co.store.id}/plans/blank`, { width: 40, depth: 25, unit: "m" })).body.id;
  const [d] = await t.ctx.db
    .insert(detectors)
    .values({
      companyId: co.company.id,
      name: "Diode sniffer",
      principle: "heated-diode",
      lastCheckedOn: new Date().toISOString().slice(0, 10),
    })
    .returning();
  detectorId = d.id;
  server = t.app.listen(0, "127.0.0.1");
  await new Promise((r) => server.once("listening", r));
  restoreFetch = installBrowserFetch(`http://127.0.0.1:${(server.address() as AddressInfo).port}`);
  await api.post("/api/auth/sign-in", null, { email: co.people.technician.email, password: PASSWORD });
});
afterAll(async () => {
  restoreFetch?.();
  await new Promise((r) => server?.close(r));
  await t.close();
});

describe("one bad character in the offline queue", () => {
  for (const [what, poison] of [
    ["a NUL character", "fan \u0000 coil"],
    ["a lone surrogate", "dairy \uD83D case"],
  ] as const) {
    it(`with ${what} in one note: the rest of the queue arrives and the bad one is held with its reason`, async () => {
      const db = await openWalkDb(`walk-${crypto.randomUUID()}`);
      const sweepId = crypto.randomUUID();
      const startedAt = new Date().toISOString();
      await saveSweep(db, {
        id: sweepId,
        storeId: co.store.id,
        planId,
        detectorId,
        detectorName: "Diode sniffer",
        systemIds: [],
        fans: "running",
        defrost: false,
        passes: [],
        startedAt,
        status: "in-progress",
        transportDelayS: 0,
        timeConstantS: 0,
        alarmPpm: 0,
        warnings: [],
        sync: { kind: "queued-new", thenSubmit: false },
      });
      const notes = Array.from({ length: 30 }, (_, i) => (i === 17 ? poison : `case ${i} 🧊`));
      for (const [i, note] of notes.entries())
        await addReading(db, sweepId, {
          x: 1 + i,
          y: 5,
          takenAt: new Date(Date.parse(startedAt) + i * 1000).toISOString(),
          ppm: i,
          atLeast: false,
          samplePoint: "grille",
          note,
        });

      const report = await syncOnce(db, httpSyncTransport);
      expect(report.stoppedBy).toBeNull();
      expect(report.confirmed).toBe(29);
      expect(report.rejected).toBe(1);
      const stored = await t.ctx.db.select().from(readings).where(eq(readings.sweepId, sweepId));
      expect(stored.length).toBe(29);
      expect(stored.some((r) => r.note.includes("\uFFFD"))).toBe(false);
      const local = await sweepReadings(db, sweepId);
      const held = local.find((r) => r.note === poison)!;
      expect(held.sync.kind).toBe("refused");
      expect(held.sync.kind === "refused" ? held.sync.reasons.note : "").toMatch(
        what === "a NUL character" ? /NUL/ : /surrogate/,
      );
      // Nothing waits any more: the loop has no reason to retry every few seconds.
      expect(await queueCounts(db)).toEqual({ waiting: 0, rejected: 1 });
      db.close();
    });
  }
});
