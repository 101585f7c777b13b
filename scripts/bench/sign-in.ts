/**
 * Sign-in benchmark: does the event loop keep answering while people sign in? 20 sign-ins run at
 * once, over and over (wrong passwords for a real account hashed at the production cost of 12, and
 * unknown addresses, which are compared against the dummy hash at the same cost), while
 * GET /api/health is timed one request after another. Target (the issue's): health p99 under 50 ms.
 *
 *   bash scripts/pg.sh start test 55200
 *   BENCH_DATABASE_URL=postgres://postgres@127.0.0.1:55200/postgres npm run bench:sign-in
 *
 * Optional: BENCH_CONCURRENT (default 20), BENCH_SECONDS (default 8), BENCH_COST (default 12);
 * the CPU pool's CPU_WORKERS and CPU_WORKER_NICE as server/env.ts reads them (defaults there).
 * The machine's load average is printed with the figures: on a shared machine it moves them.
 */
import os from "node:os";
import type { AddressInfo } from "node:net";
import { performance } from "node:perf_hooks";
import bcrypt from "bcryptjs";
import { eq } from "drizzle-orm";

const adminUrl = process.env.BENCH_DATABASE_URL ?? process.env.TEST_ADMIN_DATABASE_URL;
if (!adminUrl) {
  console.error(
    "Set BENCH_DATABASE_URL (or TEST_ADMIN_DATABASE_URL), e.g. postgres://postgres@127.0.0.1:55200/postgres",
  );
  process.exit(2);
}
process.env.TEST_ADMIN_DATABASE_URL = adminUrl;

const { createTestApp } = await import("../../tests/helpers/test-app");
const { seedCompany } = await import("../../tests/helpers/fixtures");
const { users } = await import("../../server/db/schema/index");

const TARGET_MS = 50;
const CONCURRENT = Number(process.env.BENCH_CONCURRENT ?? 20);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 8);
const COST = Number(process.env.BENCH_COST ?? 12);

const { configureCpuPool, cpuPool } = await import("../../server/jobs/cpu-pool");
const { readEnv } = await import("../../server/env");

const env = readEnv({ ...process.env, DATABASE_URL: adminUrl });
configureCpuPool({ maxThreads: env.CPU_WORKERS, niceIncrement: env.CPU_WORKER_NICE });
const t = await createTestApp({ bcryptCost: COST, loginRateLimit: 1_000_000 });
const server = t.app.listen(0, "127.0.0.1");
await new Promise((r) => server.once("listening", r));
const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
try {
  const co = await seedCompany(t.ctx, "Benchmark Provisions");
  await t.ctx.db
    .update(users)
    .set({ passwordHash: await bcrypt.hash("the real passphrase", COST) })
    .where(eq(users.id, co.people.technician.userId));

  // One anonymous session (cookie + CSRF token) per signing-in client.
  async function client() {
    const res = await fetch(`${base}/api/auth/session`);
    const cookie = res.headers.getSetCookie()[0].split(";")[0];
    const { csrfToken } = (await res.json()) as { csrfToken: string };
    return { cookie, csrfToken };
  }
  const clients = await Promise.all(Array.from({ length: CONCURRENT }, client));
  const until = performance.now() + SECONDS * 1000;
  let signIns = 0;
  const signers = clients.map(async (c, i) => {
    while (performance.now() < until) {
      await fetch(`${base}/api/auth/sign-in`, {
        method: "POST",
        headers: { "Content-Type": "application/json", Cookie: c.cookie, "X-CSRF-Token": c.csrfToken },
        body: JSON.stringify({
          email: i % 2 ? co.people.technician.email : `nobody-${i}@benchmark.test`,
          password: "a wrong passphrase",
        }),
      });
      signIns++;
    }
  });
  const health: number[] = [];
  const probe = (async () => {
    await new Promise((r) => setTimeout(r, 200)); // let the sign-ins get going
    while (performance.now() < until) {
      const start = performance.now();
      await (await fetch(`${base}/api/health`)).text();
      health.push(performance.now() - start);
      await new Promise((r) => setTimeout(r, 10));
    }
  })();
  await Promise.all([...signers, probe]);
  health.sort((a, b) => a - b);
  const q = (p: number) => health[Math.min(health.length - 1, Math.floor(p * health.length))];
  const load = os.loadavg()[0].toFixed(1);
  console.log(
    `sign-in: ${CONCURRENT} concurrent sign-ins at cost ${COST} for ${SECONDS} s (${signIns} done) on ` +
      `${cpuPool().options.maxThreads} CPU worker(s), nice +${cpuPool().options.niceIncrement}, load average ${load}; ` +
      `GET /api/health ×${health.length}: p50 ${q(0.5).toFixed(1)} ms, p99 ${q(0.99).toFixed(1)} ms, ` +
      `max ${health[health.length - 1].toFixed(1)} ms (target p99 < ${TARGET_MS} ms: ${q(0.99) < TARGET_MS ? "met" : "NOT met"})`,
  );
} finally {
  server.closeAllConnections();
  await new Promise((r) => server.close(r));
  await t.close();
}
