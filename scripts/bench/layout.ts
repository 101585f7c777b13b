/**
 * Layout benchmark, API half: how fast a plan with 400 fixtures loads through the API.
 * Target (docs/benchmarks.md): GET /api/plans/:id/fixtures under 100 ms, median of repeated requests.
 *
 * Run it against any PostgreSQL where it may create and drop a database of its own:
 *
 *   bash scripts/pg.sh start test 55200            # once, the same throw-away cluster the tests use
 *   BENCH_DATABASE_URL=postgres://postgres@127.0.0.1:55200/postgres npm run bench:layout
 *
 * TEST_ADMIN_DATABASE_URL (the tests' convention) works too. The script creates
 * `plumeline_bench_<pid>`, migrates it, seeds one company, a blank 100 m × 60 m plan and 400
 * fixtures (saved through the API), serves the real app on 127.0.0.1, times the requests with
 * fetch (including reading and parsing the JSON), prints the figures, and drops the database.
 * Optional: BENCH_REQUESTS (default 200), BENCH_FIXTURES (default 400).
 */
import http from "node:http";
import os from "node:os";
import { randomUUID } from "node:crypto";
import { performance } from "node:perf_hooks";
import bcrypt from "bcryptjs";
import pg from "pg";
import pino from "pino";
import { createApp } from "../../server/app";
import type { AppContext } from "../../server/context";
import { createDb, migrateDb } from "../../server/db/client";
import { companies, memberships, stores, users } from "../../server/db/schema/index";
import type { Fixture } from "#core/contracts/fixtures";
import { createSmtpMailer } from "../../server/mail/mailer";
import { createMailQueue } from "../../server/mail/mail-queue";
import { measureEditorDrag } from "./layout-editor";

const TARGET_MS = 100;

function adminUrl(): string {
  const url = process.env.BENCH_DATABASE_URL ?? process.env.TEST_ADMIN_DATABASE_URL;
  if (!url) {
    console.error(
      "Set BENCH_DATABASE_URL (or TEST_ADMIN_DATABASE_URL) to an admin URL, e.g.\n  bash scripts/pg.sh start test 55200\n  BENCH_DATABASE_URL=postgres://postgres@127.0.0.1:55200/postgres npm run bench:layout",
    );
    process.exit(2);
  }
  return url;
}

/** 400 fixtures like a real store: case lineups (4 vertices), rooms with doors, zones, points. */
function fixtures(n: number): Fixture[] {
  const list: Fixture[] = [];
  for (let i = 0; i < n; i++) {
    const col = i % 20,
      row = Math.floor(i / 20);
    const x = 1 + col * 4.9,
      y = 1 + row * 2.9;
    const box: [number, number][] = [
      [x, y],
      [x + 3.66, y],
      [x + 3.66, y + 1.1],
      [x, y + 1.1],
    ];
    const base = { id: randomUUID(), label: `Fixture ${i + 1}`, systemId: null, hasFans: i % 2 === 0 };
    switch (i % 8) {
      case 0:
        list.push({ ...base, kind: "door-case", polygon: box, doorCount: 5 });
        break;
      case 1:
        list.push({ ...base, kind: "walk-in-cooler", polygon: box, door: { edge: 2, offset: 0.5, width: 1 } });
        break;
      case 2:
        list.push({ ...base, kind: "benign-zone", polygon: box, note: "aerosols", typicalPpm: 3 });
        break;
      case 3:
        list.push({ ...base, kind: "valve", point: { x: x + 1, y: y + 0.5 } });
        break;
      case 4: {
        // An L-shaped gondola end (6 vertices).
        list.push({
          ...base,
          kind: "gondola",
          polygon: [
            [x, y],
            [x + 3.6, y],
            [x + 3.6, y + 0.6],
            [x + 1.2, y + 0.6],
            [x + 1.2, y + 1.2],
            [x, y + 1.2],
          ],
        });
        break;
      }
      default:
        list.push({ ...base, kind: i % 2 ? "open-case" : "island-case", polygon: box });
    }
  }
  return list;
}

function median(sorted: number[]): number {
  const m = sorted.length >> 1;
  return sorted.length % 2 ? sorted[m] : (sorted[m - 1] + sorted[m]) / 2;
}

async function main() {
  const requests = Number(process.env.BENCH_REQUESTS ?? 200);
  const count = Number(process.env.BENCH_FIXTURES ?? 400);
  const name = `plumeline_bench_${process.pid}`;
  const admin = new pg.Client({ connectionString: adminUrl() });
  await admin.connect();
  await admin.query(`create database ${name}`);
  const url = new URL(adminUrl());
  url.pathname = `/${name}`;
  const { pool, db } = createDb(url.toString());
  const logger = pino({ level: "silent" });
  const mailer = createMailQueue(
    db,
    createSmtpMailer({ host: "127.0.0.1", port: 9, secure: false, from: "bench@plumeline.test" }, true),
    logger,
  );
  let server: http.Server | undefined;
  try {
    await migrateDb(db);
    const ctx: AppContext = {
      db,
      pool,
      mailer,
      logger,
      config: {
        sessionSecret: "bench-secret-bench-secret",
        bcryptCost: 4,
        loginRateLimit: 1000,
        loginRateWindowMs: 60_000,
        appUrl: "http://bench.test",
        outboxEnabled: false,
        uploadsDir: os.tmpdir(),
        secureCookies: false,
        serveClient: true,
      },
    };
    const [company] = await db.insert(companies).values({ name: "Benchmark Grocers" }).returning();
    const [store] = await db
      .insert(stores)
      .values({ companyId: company.id, name: "Benchmark – Long Aisles", timeZone: "UTC" })
      .returning();
    const password = "benchmark password";
    const [user] = await db
      .insert(users)
      .values({ email: "lead@bench.test", name: "Bench Lead", passwordHash: await bcrypt.hash(password, 4) })
      .returning();
    await db.insert(memberships).values({ companyId: company.id, userId: user.id, role: "lead-tech" });

    server = http.createServer(createApp(ctx));
    await new Promise<void>((resolve) => server!.listen(0, "127.0.0.1", resolve));
    const base = `http://127.0.0.1:${(server.address() as { port: number }).port}/api`;
    let cookie = "";
    let csrf = "";
    const call = async (method: string, path: string, body?: unknown) => {
      const res = await fetch(base + path, {
        method,
        headers: { cookie, "content-type": "application/json", "x-csrf-token": csrf },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      const set = res.headers.getSetCookie().map((c) => c.split(";")[0]);
      if (set.length) cookie = set.join("; ");
      const json = await res.json();
      if (json && typeof json.csrfToken === "string") csrf = json.csrfToken;
      if (!res.ok) throw new Error(`${method} ${path} → ${res.status} ${JSON.stringify(json).slice(0, 300)}`);
      return json;
    };
    await call("GET", "/auth/session");
    await call("POST", "/auth/sign-in", { email: "lead@bench.test", password });
    const plan = await call("POST", `/stores/${store.id}/plans/blank`, { width: 100, depth: 60 });
    const list = fixtures(count);
    const t0 = performance.now();
    await call("PUT", `/plans/${plan.id}/fixtures`, { layoutRevision: plan.layoutRevision, fixtures: list });
    const saveMs = performance.now() - t0;

    const once = async () => {
      const start = performance.now();
      const res = await fetch(`${base}/plans/${plan.id}/fixtures`, { headers: { cookie } });
      const text = await res.text();
      const body = JSON.parse(text);
      const ms = performance.now() - start;
      if (res.status !== 200 || body.fixtures.length !== count) throw new Error(`unexpected answer ${res.status}`);
      return { ms, bytes: Buffer.byteLength(text) };
    };
    for (let i = 0; i < 20; i++) await once(); // warm-up: JIT, connection pool, plan cache
    const times: number[] = [];
    let bytes = 0;
    for (let i = 0; i < requests; i++) {
      const r = await once();
      times.push(r.ms);
      bytes = r.bytes;
    }
    times.sort((a, b) => a - b);
    const med = median(times);
    const p95 = times[Math.min(times.length - 1, Math.floor(times.length * 0.95))];
    console.log(`layout API benchmark (${os.cpus().length} cores, Node ${process.version})`);
    console.log(`  plan with ${count} fixtures, response ${(bytes / 1024).toFixed(1)} KiB`);
    console.log(`  PUT all fixtures once: ${saveMs.toFixed(1)} ms`);
    console.log(
      `  GET /api/plans/:id/fixtures × ${requests}: median ${med.toFixed(2)} ms, p95 ${p95.toFixed(2)} ms, min ${times[0].toFixed(2)} ms, max ${times.at(-1)!.toFixed(2)} ms`,
    );
    console.log(`  target: median under ${TARGET_MS} ms → ${med < TARGET_MS ? "MET" : "NOT MET"}`);
    if (process.env.BENCH_SKIP_EDITOR === "1") console.log("  editor frame times: skipped (BENCH_SKIP_EDITOR=1)");
    else {
      // The editor half needs the built client (dist/client): `npx vite build` first.
      const origin = base.replace(/\/api$/, "");
      const f = await measureEditorDrag({
        origin,
        email: "lead@bench.test",
        password,
        storeId: store.id,
        planId: plan.id,
      }).catch((err) => {
        console.error("  editor benchmark failed:", err instanceof Error ? err.message : err);
        process.exitCode = 1;
        return null;
      });
      if (f)
        console.log(
          `  editor, dragging one of ${f.fixturesOnPage} fixtures in Chromium (${f.frames} frames over 3 drags of ${f.dragMs.toFixed(0)} ms; it moved ${f.movedM.toFixed(2)} m in all):`,
        );
      if (f)
        console.log(
          `    frame time median ${f.medianMs.toFixed(1)} ms, p95 ${f.p95Ms.toFixed(1)} ms, max ${f.maxMs.toFixed(1)} ms; frames over 33.4 ms: ${f.longFrames}`,
        );
      if (f)
        console.log(
          `    the same pointer path without a drag (page and machine alone): median ${f.hover.medianMs.toFixed(1)} ms, p95 ${f.hover.p95Ms.toFixed(1)} ms; ${f.hover.longFrames} of ${f.hover.frames} frames over 33.4 ms`,
        );
    }
    if (med >= TARGET_MS) process.exitCode = 1;
  } finally {
    await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
    mailer.close();
    pool.on("error", () => {}); // a client told to end may still be saying goodbye when the database goes
    await pool.end();
    for (let i = 0; i < 40; i++) {
      const { rows } = await admin.query("select count(*)::int as n from pg_stat_activity where datname = $1", [name]);
      if (rows[0].n === 0) break;
      await new Promise((r) => setTimeout(r, 50));
    }
    await admin.query(`drop database if exists ${name} with (force)`);
    await admin.end();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
