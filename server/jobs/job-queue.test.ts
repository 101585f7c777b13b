import pino from "pino";
import PgBoss from "pg-boss";
import { afterAll, beforeAll, expect, it } from "vitest";
import { createTestApp, signIn, type TestApp } from "../../tests/helpers/test-app";
import { seedCompany } from "../../tests/helpers/fixtures";
import type { AppContext } from "../context";
import { createJobQueue, JOBS_DEAD_LETTER, type JobQueue } from "./job-queue";
import { DIGEST_JOB, startJobs } from "./job-kinds";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
const queues: JobQueue[] = [];
const quiet = pino({ level: "silent" });

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Bracken Provisions");
});
afterAll(async () => {
  for (const q of queues) await q.stop(2_000);
  await t.close();
});

function queue(options: Parameters<typeof createJobQueue>[2] = {}) {
  const q = createJobQueue(t.database.db, quiet, { pollingIntervalS: 0.5, ...options });
  queues.push(q);
  return q;
}

async function jobRow(name: string, id: string) {
  const { rows } = await t.ctx.pool.query(
    "select state, retry_count, output from pgboss.job where name = $1 and id = $2",
    [name, id],
  );
  return rows[0] as { state: string; retry_count: number; output: { reason?: string } | null } | undefined;
}

async function until<T>(read: () => Promise<T>, ok: (v: T) => boolean, ms = 30_000): Promise<T> {
  const by = Date.now() + ms;
  for (;;) {
    const v = await read();
    if (ok(v) || Date.now() > by) return v;
    await new Promise((r) => setTimeout(r, 200));
  }
}

it("a digest that fails on every try ends failed, in the dead-letter queue, and on the owner's list with its reason", async () => {
  // The message cannot even be queued: sendDigest throws, so the job fails and is not retried (retries 0).
  const failing: AppContext = {
    ...t.ctx,
    mailer: { ...t.ctx.mailer, send: () => Promise.reject(new Error("queue unavailable")) },
  };
  const jobs = queue();
  await startJobs(failing, jobs, { retries: { limit: 0, delayS: 1 } });
  const id = (await jobs.send(DIGEST_JOB, { companyId: co.company.id }))!;
  const row = await until(
    () => jobRow(DIGEST_JOB, id),
    (r) => r?.state === "failed",
  );
  expect(row).toMatchObject({ state: "failed", output: { reason: "queue unavailable" } });
  const dead = await t.ctx.pool.query("select data from pgboss.job where name = $1", [JOBS_DEAD_LETTER]);
  expect(dead.rows.map((r) => r.data.companyId)).toContain(co.company.id);

  const owner = await signIn(t.app, co.people.owner);
  const list = await owner.get("/api/jobs/failed");
  expect(list.status).toBe(200);
  expect(list.body.jobs).toContainEqual(
    expect.objectContaining({ id, kind: "digest", attempts: 1, reason: "queue unavailable", to: [] }),
  );
  // Another company's owner sees none of it.
  const stranger = await seedCompany(t.ctx, "Sorrel Markets");
  expect((await (await signIn(t.app, stranger.people.owner)).get("/api/jobs/failed")).body.jobs).toEqual([]);
  await jobs.stop(2_000);
}, 60_000);

it("a try past its time limit fails with the limit as its reason", async () => {
  const jobs = queue();
  await jobs.start({
    "slow-test": {
      retryLimit: 0,
      retryDelayS: 1,
      timeLimitS: 1,
      run: () => new Promise((r) => setTimeout(r, 5_000)),
    },
  });
  const id = (await jobs.send("slow-test", {}))!;
  const row = await until(
    () => jobRow("slow-test", id),
    (r) => r?.state === "failed",
  );
  expect(row?.output?.reason).toBe("took longer than its time limit of 1 s");
  await jobs.stop(2_000);
}, 30_000);

it("a job taken by a worker that died is handed out again once it expires, and another worker runs it", async () => {
  const ran: string[] = [];
  const definition = { retryLimit: 2, retryDelayS: 1, timeLimitS: 1, run: async () => void ran.push("done") };
  // The crashed worker: takes the job and never answers (as a process killed mid-job).
  const crashed = new PgBoss({
    db: { executeSql: (text: string, values: unknown[]) => t.ctx.pool.query(text, values) },
    schedule: false,
    supervise: false,
  });
  await crashed.start();
  const sender = queue({ expiryMarginS: 0 });
  await sender.start({ "crash-test": definition }, { work: false });
  const id = (await sender.send("crash-test", {}))!;
  const [taken] = await crashed.fetch("crash-test");
  expect(taken.id).toBe(id);
  await crashed.stop({ graceful: false, wait: true });
  // A live worker whose maintenance expires it (time limit 1 s, margin 0) and runs the retry.
  const survivor = queue({ expiryMarginS: 0, maintenanceIntervalS: 1 });
  await survivor.start({ "crash-test": definition });
  const row = await until(
    () => jobRow("crash-test", id),
    (r) => r?.state === "completed",
  );
  expect(row?.state).toBe("completed");
  expect(row?.retry_count).toBe(1);
  expect(ran).toEqual(["done"]);
}, 60_000);
