// Fault tests: the app stopped mid-burst, gracefully (SIGTERM) and not (SIGKILL), then started
// again in place. Own cluster, app as a child process, loopback only, bounded in time.
import http from "node:http";
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, expect, it } from "vitest";
import { startOwnCluster, type OwnCluster } from "../helpers/own-cluster";
import { faultFixture, type FaultFixture } from "../helpers/fault-fixture";
import { describeStats, startBurst, type BurstStats } from "../helpers/sync-burst";

let cluster: OwnCluster;
let f: FaultFixture;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

beforeAll(async () => {
  cluster = await startOwnCluster("fault-stop");
  // The sync throttle (600 requests a minute per member, tested in server/api/sweeps/sync-throttle.test.ts)
  // is set out of reach: six devices can pass it within the first test, and the second test then
  // waited out the rest of the minute on 503s (54 s of its 60 s), which proves nothing about a stop.
  f = await faultFixture(cluster, { SHUTDOWN_DELAY_MS: "700", SHUTDOWN_GRACE_MS: "10000", SYNC_RATE_LIMIT: "100000" });
}, 120_000);

afterAll(async () => {
  if (f?.app.alive()) {
    f.app.kill("SIGKILL");
    await f.app.exited;
  }
  await cluster?.destroy();
}, 60_000);

/** A batch whose body is sent in two halves `gapMs` apart: an upload in flight. */
function slowUpload(ids: string[], gapMs: number, onFirstHalf: () => void): Promise<{ status: number; body: string }> {
  const body = JSON.stringify({
    readings: ids.map((id, i) => ({
      id,
      x: 2 + i * 0.1,
      y: 2,
      takenAt: new Date(f.startedAt.getTime() + 2_000 + i).toISOString(),
      ppm: 1,
      samplePoint: "grille",
    })),
  });
  const buf = Buffer.from(body);
  return new Promise((resolve, reject) => {
    const req = http.request(
      `${f.app.url}/api/sweeps/${f.sweepId}/readings`,
      { method: "POST", headers: { ...f.tech.writeHeaders(), "content-length": String(buf.length) } },
      (res) => {
        let text = "";
        res.on("data", (d) => (text += d));
        res.on("end", () => resolve({ status: res.statusCode!, body: text }));
      },
    );
    req.on("error", reject);
    req.write(buf.subarray(0, buf.length >> 1));
    setTimeout(onFirstHalf, 50);
    setTimeout(() => req.end(buf.subarray(buf.length >> 1)), gapMs);
  });
}

async function burstThrough(stopApp: (stats: BurstStats) => Promise<void>) {
  const { stats, finish } = startBurst(f);
  await sleep(1_500);
  await stopApp(stats);
  await f.restart();
  await sleep(1_500);
  return finish();
}

async function expectExactlyOnce(stats: BurstStats, extra: string[] = []) {
  const stored = await f.storedIds();
  const storedSet = new Set(stored);
  expect(stored.length).toBe(storedSet.size);
  expect(stats.abandoned).toBe(0);
  expect(stats.acknowledged.size).toBe(stats.sentIds.size);
  for (const id of [...stats.acknowledged, ...extra]) expect(storedSet.has(id)).toBe(true);
  return stored.length;
}

it("SIGTERM mid-burst: not ready at once, the upload in flight is finished, the pool closes last, nothing lost", async () => {
  const before = (await f.storedIds()).length;
  const slowIds = Array.from({ length: 40 }, () => randomUUID());
  let slow: Promise<{ status: number; body: string }> | null = null;
  let readyWhileDraining = 0;
  let exitCode: number | string = "";
  const stats = await burstThrough(async () => {
    const old = f.app;
    slow = slowUpload(slowIds, 1_200, () => old.kill("SIGTERM"));
    await sleep(300);
    readyWhileDraining = (await fetch(`${old.url}/readyz`)).status;
    exitCode = await old.exited;
    expect(old.output()).not.toMatch(/Cannot use a pool after calling end|Unhandled|ECONNRESET/);
  });
  const upload = await slow!;
  const stored = await expectExactlyOnce(stats, slowIds);
  console.log(
    `SIGTERM: ${describeStats(stats)}; in-flight upload answered ${upload.status}; ${stored - before} stored; exit ${exitCode}`,
  );
  expect(readyWhileDraining).toBe(503);
  expect(exitCode).toBe(0);
  expect(upload.status).toBe(200);
  const answer = JSON.parse(upload.body);
  expect([...answer.stored].sort()).toEqual([...slowIds].sort());
  expect(answer).toMatchObject({ duplicates: [], rejected: [] });
  expect(stored - before).toBe(stats.acknowledged.size + slowIds.length);
}, 120_000);

it("SIGKILL mid-burst: acknowledged readings survive and the re-sent ones land once", async () => {
  const before = (await f.storedIds()).length;
  let killedWith: number | string = "";
  const stats = await burstThrough(async () => {
    f.app.kill("SIGKILL");
    killedWith = await f.app.exited;
  });
  const stored = await expectExactlyOnce(stats);
  console.log(`SIGKILL: ${describeStats(stats)}; ${stored - before} stored`);
  expect(killedWith).toBe("SIGKILL");
  expect(stats.answers.get("network") ?? 0).toBeGreaterThan(0);
  expect(stored - before).toBe(stats.acknowledged.size);
}, 120_000);
