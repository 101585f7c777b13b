/**
 * Load benchmark (not a test): the production build (dist/server, built first) as a child process
 * on loopback, on a database of its own, driven by simulated Walk devices over HTTP.
 *
 *   open loop:   LOAD_OPEN_TECHS (200) technicians, each sending one batch of 25 readings every
 *                5 s, 10 % of batches sent a second time (a lost answer), for LOAD_SECONDS (60).
 *                Latency is timed from each batch's scheduled moment, so a slow server cannot hide
 *                its queue (no coordinated omission). Targets: 0 errors, p99 <= 150 ms.
 *   closed loop: LOAD_CLOSED_TECHS (50) technicians sending the next batch as soon as the last is
 *                answered (same 10 % re-sends), for LOAD_SECONDS. Figures: readings/s, p50, p99.
 * After each phase every reading is counted in the database: stored exactly once.
 *
 *   bash scripts/pg.sh start bench 56100
 *   BENCH_DATABASE_URL=postgres://postgres@127.0.0.1:56100/postgres npm run bench:load
 *   LOAD_SECONDS=10 npm run bench:load        (a quick run)
 *
 * The load generator shares the machine with the server: say the load average with the figures.
 */
import { execFileSync } from "node:child_process";
import { randomUUID } from "node:crypto";
import os from "node:os";
import bcrypt from "bcryptjs";
import pg from "pg";

const adminUrl = process.env.BENCH_DATABASE_URL ?? process.env.TEST_ADMIN_DATABASE_URL;
if (!adminUrl) {
  console.error(
    "Set BENCH_DATABASE_URL (or TEST_ADMIN_DATABASE_URL), e.g. postgres://postgres@127.0.0.1:56100/postgres",
  );
  process.exit(2);
}
const SECONDS = Number(process.env.LOAD_SECONDS ?? 60);
const OPEN_TECHS = Number(process.env.LOAD_OPEN_TECHS ?? 200);
const CLOSED_TECHS = Number(process.env.LOAD_CLOSED_TECHS ?? 50);
const BATCH = 25;
const PERIOD_MS = 5_000;
const RESEND = 0.1;
const P99_TARGET_MS = 150;

const { createDb, migrateDb } = await import("../../server/db/client");
const { companies, detectors, memberships, stores, users } = await import("../../server/db/schema/index");
const { startAppProcess } = await import("../../tests/helpers/app-process");
const { signInOverHttp } = await import("../../tests/helpers/http-session");

console.log("building the server (node scripts/build.mjs)...");
execFileSync(process.execPath, ["scripts/build.mjs"], { stdio: "inherit" });

const dbName = `plumeline_load_${randomUUID().slice(0, 8)}`;
const admin = new pg.Client({ connectionString: adminUrl });
await admin.connect();
await admin.query(`create database ${dbName}`);
const url = new URL(adminUrl);
url.pathname = `/${dbName}`;
const databaseUrl = url.toString();

// Invented company; one technician account per simulated device (the sync limit is per member).
const { pool, db } = createDb(databaseUrl);
await migrateDb(db);
const [company] = await db.insert(companies).values({ name: "Loadstone Grocers" }).returning();
const [store] = await db
  .insert(stores)
  .values({ companyId: company.id, name: "Loadstone Grocers – Quarry Road", timeZone: "UTC" })
  .returning();
const [detector] = await db
  .insert(detectors)
  .values({
    companyId: company.id,
    name: "Diode sniffer",
    principle: "heated-diode",
    lastCheckedOn: new Date().toISOString().slice(0, 10),
  })
  .returning();
const PASSWORD = "load test passphrase";
const hash = await bcrypt.hash(PASSWORD, 4);
const techs = Math.max(OPEN_TECHS, CLOSED_TECHS);
const emails: string[] = [];
for (let k = 0; k < techs; k++) {
  const email = `tech${k}@loadstone.test`;
  const [u] = await db
    .insert(users)
    .values({ email, name: `Technician ${k}`, passwordHash: hash })
    .returning();
  await db.insert(memberships).values({ companyId: company.id, userId: u.id, role: "technician" });
  emails.push(email);
}
const [owner] = await db
  .insert(users)
  .values({ email: "owner@loadstone.test", name: "Owner", passwordHash: hash })
  .returning();
await db.insert(memberships).values({ companyId: company.id, userId: owner.id, role: "owner" });

const app = await startAppProcess({
  DATABASE_URL: databaseUrl,
  NODE_ENV: "production",
  LOG_LEVEL: "warn",
  // One shared limit for sign-in while devices connect; sync keeps its production limit (600/min per member).
  LOGIN_RATE_LIMIT: "1000",
});

interface Device {
  session: Awaited<ReturnType<typeof signInOverHttp>>;
  sweepId: string;
  startedAt: Date;
  n: number;
}

const ownerSession = await signInOverHttp(app.url, "owner@loadstone.test", PASSWORD);
const plan = await ownerSession.request("POST", `/api/stores/${store.id}/plans/blank`, {
  width: 40,
  depth: 25,
  unit: "m",
});
const planId = (await plan.json()).id as string;

async function device(email: string): Promise<Device> {
  const session = await signInOverHttp(app.url, email, PASSWORD);
  const startedAt = new Date(Date.now() - 60_000);
  const res = await session.request("POST", `/api/stores/${store.id}/sweeps`, {
    id: randomUUID(),
    planId,
    detectorId: detector.id,
    fans: "running",
    defrost: false,
    startedAt: startedAt.toISOString(),
  });
  if (res.status !== 201) throw new Error(`sweep: ${res.status} ${await res.text()}`);
  return { session, sweepId: (await res.json()).id, startedAt, n: 0 };
}

function batchFor(d: Device) {
  return Array.from({ length: BATCH }, () => {
    const i = d.n++;
    return {
      id: randomUUID(),
      x: 1 + (i % 70) * 0.5,
      y: 1 + (Math.floor(i / 70) % 20),
      takenAt: new Date(d.startedAt.getTime() + 1000 + i * 100).toISOString(),
      ppm: i % 7,
      samplePoint: "grille",
    };
  });
}

interface PhaseStats {
  latencies: number[];
  errors: Map<string, number>;
  sent: Set<string>;
  acknowledged: Set<string>;
  requests: number;
  resends: number;
}

const newPhase = (): PhaseStats => ({
  latencies: [],
  errors: new Map(),
  sent: new Set(),
  acknowledged: new Set(),
  requests: 0,
  resends: 0,
});

/** One POST of a batch; its latency timed from `from` (the scheduled moment in the open loop). */
async function send(s: PhaseStats, d: Device, readings: ReturnType<typeof batchFor>, from: number) {
  s.requests++;
  try {
    const res = await d.session.request("POST", `/api/sweeps/${d.sweepId}/readings`, { readings });
    const body = await res.text();
    s.latencies.push(performance.now() - from);
    if (res.status !== 200) {
      const k = String(res.status);
      s.errors.set(k, (s.errors.get(k) ?? 0) + 1);
      return;
    }
    const parsed = JSON.parse(body) as { rejected: unknown[] };
    if (parsed.rejected.length) s.errors.set("rejected", (s.errors.get("rejected") ?? 0) + 1);
    for (const r of readings) s.acknowledged.add(r.id);
  } catch (err) {
    s.latencies.push(performance.now() - from);
    const k = `network: ${(err as Error).message}`;
    s.errors.set(k, (s.errors.get(k) ?? 0) + 1);
  }
}

async function oneBatch(s: PhaseStats, d: Device, from: number) {
  const readings = batchFor(d);
  for (const r of readings) s.sent.add(r.id);
  await send(s, d, readings, from);
  if (Math.random() < RESEND) {
    s.resends++;
    await send(s, d, readings, performance.now());
  }
}

async function openLoop(devices: Device[]): Promise<PhaseStats> {
  const s = newPhase();
  const t0 = performance.now() + 200;
  const end = t0 + SECONDS * 1000;
  const inflight: Promise<void>[] = [];
  await Promise.all(
    devices.map(async (d, k) => {
      // Spread the devices over the period; each keeps its own schedule, whatever the answers do.
      for (let at = t0 + (k * PERIOD_MS) / devices.length; at < end; at += PERIOD_MS) {
        const wait = at - performance.now();
        if (wait > 0) await new Promise((r) => setTimeout(r, wait));
        inflight.push(oneBatch(s, d, at));
      }
    }),
  );
  await Promise.all(inflight);
  return s;
}

async function closedLoop(devices: Device[]): Promise<PhaseStats & { seconds: number }> {
  const s = newPhase();
  const t0 = performance.now();
  const end = t0 + SECONDS * 1000;
  await Promise.all(
    devices.map(async (d) => {
      while (performance.now() < end) await oneBatch(s, d, performance.now());
    }),
  );
  return { ...s, seconds: (performance.now() - t0) / 1000 };
}

/** Stored exactly once: every acknowledged reading is there once, and nothing that was not sent. */
async function countStored(devices: Device[], s: PhaseStats) {
  const { rows } = await pool.query<{ id: string }>("select id from readings where sweep_id = any($1::uuid[])", [
    devices.map((d) => d.sweepId),
  ]);
  const ids = rows.map((r) => r.id);
  const unique = new Set(ids);
  const missing = [...s.acknowledged].filter((id) => !unique.has(id)).length;
  const strangers = ids.filter((id) => !s.sent.has(id)).length;
  return { rows: ids.length, duplicates: ids.length - unique.size, missing, strangers };
}

function pct(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? NaN;
}

function report(name: string, s: PhaseStats, stored: Awaited<ReturnType<typeof countStored>>, seconds: number) {
  const errors = [...s.errors].map(([k, v]) => `${k}×${v}`).join(", ") || "0";
  const readingsPerS = (s.requests * BATCH) / seconds;
  console.log(
    `${name}: ${s.requests} requests (${s.resends} re-sends) in ${seconds.toFixed(1)} s, ${readingsPerS.toFixed(0)} readings/s sent; ` +
      `p50 ${pct(s.latencies, 50).toFixed(1)} ms, p99 ${pct(s.latencies, 99).toFixed(1)} ms, max ${Math.max(...s.latencies).toFixed(0)} ms; errors: ${errors}`,
  );
  // Exactly once: every acknowledged reading stored once, nothing stored twice, nothing unknown. A
  // reading stored whose answer was lost (an error above) is fine: the device's re-send is a duplicate.
  const once = stored.duplicates === 0 && stored.missing === 0 && stored.strangers === 0;
  console.log(
    `  stored ${stored.rows} rows for ${s.acknowledged.size} acknowledged readings (${s.sent.size} sent, ` +
      `${stored.rows - s.acknowledged.size} stored without an answer): ${stored.duplicates} duplicates, ` +
      `${stored.missing} acknowledged but missing, ${stored.strangers} unknown -> ${once ? "exactly once" : "NOT exactly once"}`,
  );
}

try {
  const load = () =>
    os
      .loadavg()
      .map((l) => l.toFixed(1))
      .join(" ");
  console.log(`${os.availableParallelism()} cores; load average before: ${load()}`);
  const openDevices = await Promise.all(emails.slice(0, OPEN_TECHS).map(device));
  const open = await openLoop(openDevices);
  const openStored = await countStored(openDevices, open);
  report(`open loop, ${OPEN_TECHS} technicians × ${BATCH} readings every 5 s`, open, openStored, SECONDS);
  console.log(
    `  target: 0 errors and p99 <= ${P99_TARGET_MS} ms -> ${open.errors.size === 0 && pct(open.latencies, 99) <= P99_TARGET_MS ? "met" : "NOT met"}; load average: ${load()}`,
  );

  const closedDevices = await Promise.all(emails.slice(0, CLOSED_TECHS).map(device));
  const closed = await closedLoop(closedDevices);
  const closedStored = await countStored(closedDevices, closed);
  report(`closed loop, ${CLOSED_TECHS} technicians as fast as answers come`, closed, closedStored, closed.seconds);
  console.log(
    `  throughput: ${((closed.acknowledged.size + 0) / closed.seconds).toFixed(0)} distinct readings/s stored; load average: ${load()}`,
  );
} finally {
  app.kill("SIGTERM");
  await app.exited;
  await pool.end();
  await admin.query(`drop database if exists ${dbName} with (force)`);
  await admin.end();
}
