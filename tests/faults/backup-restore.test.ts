// Backup and restore round trip: the demo company (with its plan image) dumped by scripts/backup.sh,
// restored by scripts/restore.sh into an empty cluster of its own, and read back through the app.
import { execFile } from "node:child_process";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, expect, it } from "vitest";
import { createApp } from "../../server/app";
import type { AppContext } from "../../server/context";
import { createDb } from "../../server/db/client";
import { DEMO_SIGN_INS, seedDemoIfEmpty } from "../../server/db/seed/demo";
import { startOwnCluster, type OwnCluster } from "../helpers/own-cluster";
import { createTestApp, signIn, type TestApp } from "../helpers/test-app";

const run = promisify(execFile);
const ROOT = path.resolve(import.meta.dirname, "../..");
let t: TestApp;
let cluster: OwnCluster;
let tmp: string;
let restored: ReturnType<typeof createDb> | null = null;

beforeAll(async () => {
  tmp = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-backup-"));
  await fs.mkdir(path.join(tmp, "uploads-a"));
  t = await createTestApp({ uploadsDir: path.join(tmp, "uploads-a") });
  expect(await seedDemoIfEmpty(t.ctx)).toBe(true);
  cluster = await startOwnCluster("backup");
}, 120_000);

afterAll(async () => {
  await restored?.pool.end();
  await t?.close();
  await cluster?.destroy();
  await fs.rm(tmp, { recursive: true, force: true });
}, 60_000);

async function tableCounts(ctx: Pick<AppContext, "pool">): Promise<Record<string, number>> {
  const { rows } = await ctx.pool.query<{ name: string }>(
    "select tablename as name from pg_tables where schemaname = 'public' order by 1",
  );
  const out: Record<string, number> = {};
  // Sessions come and go with every sign-in below; everything else must match.
  for (const { name } of rows.filter((r) => r.name !== "session"))
    out[name] = (await ctx.pool.query(`select count(*)::int as n from "${name}"`)).rows[0].n;
  return out;
}

async function whatAPersonSees(app: ReturnType<typeof createApp>) {
  const lead = DEMO_SIGN_INS.people.find((p) => p.role === "lead-tech")!;
  const a = await signIn(app, { email: lead.email }, DEMO_SIGN_INS.password);
  const stores = (await a.get("/api/stores")).body.stores;
  const store = (await a.get(`/api/stores/${stores[0].id}`)).body;
  const image = await a.agent.get(`/api/plans/${store.currentPlan.id}/image`).buffer(true);
  const sweeps = (await a.get(`/api/stores/${stores[0].id}/sweeps`)).body.sweeps;
  const readings = await Promise.all(
    sweeps.map(async (s: { id: string }) => (await a.get(`/api/sweeps/${s.id}/readings`)).body.readings),
  );
  return { stores, store, imageStatus: image.status, image: image.body as Buffer, sweeps, readings };
}

it("a backup restored into an empty cluster reads back the same records and plan images, and restore never overwrites", async () => {
  const dest = path.join(tmp, "backups");
  const backup = await run("bash", ["scripts/backup.sh", dest], {
    cwd: ROOT,
    env: { ...process.env, DATABASE_URL: t.database.url, UPLOADS_DIR: path.join(tmp, "uploads-a") },
  });
  const [dump, archive] = backup.stdout.trim().split("\n");
  expect(dump).toMatch(/plumeline-\d{8}T\d{6}Z\.dump$/);
  expect(archive).toMatch(/-uploads\.tar\.gz$/);

  const target = cluster.url("plumeline");
  const uploadsB = path.join(tmp, "uploads-b");
  await run("bash", ["scripts/restore.sh", dump, archive], {
    cwd: ROOT,
    env: { ...process.env, DATABASE_URL: target, UPLOADS_DIR: uploadsB },
  });

  restored = createDb(target);
  const ctxB: AppContext = {
    ...t.ctx,
    db: restored.db,
    pool: restored.pool,
    storage: undefined,
    config: { ...t.ctx.config, uploadsDir: uploadsB },
  };
  const before = await tableCounts(t.ctx);
  const after = await tableCounts(ctxB);
  expect(after).toEqual(before);
  expect(before.readings).toBeGreaterThan(0);
  expect(before.plan_versions ?? before.plans).toBeGreaterThan(0);

  const original = await whatAPersonSees(t.app);
  const copy = await whatAPersonSees(createApp(ctxB));
  expect(copy.imageStatus).toBe(200);
  expect(copy.image.length).toBeGreaterThan(1000);
  expect(copy.image.equals(original.image)).toBe(true);
  expect(copy.stores).toEqual(original.stores);
  expect(copy.store).toEqual(original.store);
  expect(copy.sweeps).toEqual(original.sweeps);
  expect(copy.readings).toEqual(original.readings);
  console.log(
    `backup round trip: ${Object.keys(before).length} tables, ${before.readings} readings, plan image ${copy.image.length} bytes`,
  );

  // A second restore onto the now-full database is refused, and nothing changes. (Signing in above
  // wrote sign-in records to both databases, so compare with the restored one as it is now.)
  const full = await tableCounts(ctxB);
  const again = await run("bash", ["scripts/restore.sh", dump, archive], {
    cwd: ROOT,
    env: { ...process.env, DATABASE_URL: target, UPLOADS_DIR: uploadsB },
  }).then(
    () => 0,
    (e: { code: number; stderr: string }) => {
      expect(e.stderr).toMatch(/refusing: plumeline already has \d+ tables/);
      return e.code;
    },
  );
  expect(again).toBe(3);
  expect(await tableCounts(ctxB)).toEqual(full);
}, 120_000);
