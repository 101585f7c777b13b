// Fault test: PostgreSQL stopped and started again under the app during a sync burst. Runs on a
// cluster of its own with the app as a child process, on loopback, bounded in time.
import { afterAll, beforeAll, expect, it } from "vitest";
import { startOwnCluster, type OwnCluster } from "../helpers/own-cluster";
import { faultFixture, type FaultFixture } from "../helpers/fault-fixture";
import { describeStats, startBurst } from "../helpers/sync-burst";

let cluster: OwnCluster;
let f: FaultFixture;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Waits for what the burst has seen to reach `ok` (a fixed pause could end before it, on a slow machine). */
async function seen(what: string, ok: () => boolean, ms = 30_000) {
  for (const by = Date.now() + ms; !ok(); await sleep(100)) {
    if (Date.now() > by) throw new Error(`${what} not seen within ${ms / 1000} s\n${f.app.output()}`);
  }
}

beforeAll(async () => {
  cluster = await startOwnCluster("fault-db");
  f = await faultFixture(cluster);
}, 120_000);

afterAll(async () => {
  if (f?.app.alive()) {
    f.app.kill("SIGKILL");
    await f.app.exited;
  }
  await cluster?.destroy();
}, 60_000);

async function probe(path: string) {
  for (let attempt = 1; ; attempt++) {
    try {
      const res = await fetch(f.app.url + path);
      return { status: res.status, body: await res.json() };
    } catch (err) {
      const reason = (err as { cause?: { message?: string } }).cause?.message ?? String(err);
      // A kept-alive socket the app closed as idle just as a loaded test process reused it: a GET
      // is sent again, as a browser does. Anything else, or a reset three times, is the answer.
      if (attempt < 3 && /ECONNRESET|socket hang up|other side closed/.test(reason)) continue;
      throw new Error(`${path}: ${reason}; the app said:\n${f.app.output()}`);
    }
  }
}

it("rides through a database restart: 503 with Retry-After while it is away, every acknowledged reading stored once", async () => {
  expect(await probe("/readyz")).toEqual({
    status: 200,
    body: { ok: true, status: "ready", database: "up" },
  });
  const { stats, finish } = startBurst(f);

  await sleep(1_000);
  // An invitation sent around the outage is still delivered.
  const invited = await f.owner.request("POST", "/api/team/invitations", {
    email: "wren.aldous@tamarack.test",
    role: "engineer",
  });
  expect(invited.status).toBe(201);
  const invitationId = (await invited.json()).id;
  await seen("a reading acknowledged before the stop", () => stats.acknowledged.size > 0);
  const beforeStop = stats.acknowledged.size;
  await cluster.stop();
  // Away: alive, not ready, and the sync is answered 503 (counted by the burst).
  await seen("a 503 while the database is away", () => (stats.answers.get(503) ?? 0) > 0);
  expect(await probe("/healthz")).toMatchObject({ status: 200, body: { ok: true } });
  expect(await probe("/api/health")).toMatchObject({ status: 200, body: { ok: true } });
  expect(await probe("/readyz")).toMatchObject({ status: 503, body: { ok: false, database: "down" } });
  const duringOutage = stats.answers.get(503) ?? 0;
  await cluster.start();
  // Ready again by itself, without a restart of the app.
  const readyBy = Date.now() + 30_000;
  while ((await probe("/readyz")).status !== 200) {
    if (Date.now() > readyBy) throw new Error(`not ready 30 s after the database came back\n${f.app.output()}`);
    await sleep(200);
  }
  const afterReturn = stats.acknowledged.size;
  await seen("a reading acknowledged after the return", () => stats.acknowledged.size > afterReturn);
  await finish();

  const stored = await f.storedIds();
  const storedSet = new Set(stored);
  const mailBy = Date.now() + 30_000;
  let delivery: { state: string } = { state: "queued" };
  while (delivery.state !== "sent" && Date.now() < mailBy) {
    const team = await (await f.owner.request("GET", "/api/team")).json();
    delivery = team.invitations.find((i: { id: string }) => i.id === invitationId).delivery;
    if (delivery.state !== "sent") await sleep(250);
  }
  console.log(
    `database restart: ${describeStats(stats)}; ${stored.length} stored; invitation e-mail ${delivery.state}`,
  );
  expect(delivery.state).toBe("sent");

  expect(f.app.alive(), f.app.output()).toBe(true);
  expect(beforeStop).toBeGreaterThan(0);
  expect(duringOutage).toBeGreaterThan(0);
  expect(stats.wellFormed503).toBe(stats.answers.get(503));
  expect(stats.answers.get(500) ?? 0).toBe(0);
  expect(stats.acknowledged.size).toBeGreaterThan(afterReturn); // syncing went on after the return
  expect(stats.abandoned).toBe(0);
  // Exactly once: every acknowledged reading is stored, nothing is stored twice or unsent.
  expect(stored.length).toBe(storedSet.size);
  expect([...stats.acknowledged].every((id) => storedSet.has(id))).toBe(true);
  expect(stored.every((id) => stats.sentIds.has(id))).toBe(true);
  expect(stats.acknowledged.size).toBe(stats.sentIds.size);
  expect(stored.length).toBe(stats.acknowledged.size);
}, 120_000);
