/**
 * A company with a plan, a detector and a technician on a fault test's own cluster, the app
 * running as a child process against it, and a sweep to sync into.
 */
import pg from "pg";
import { createDb, migrateDb } from "../../server/db/client";
import { detectors } from "../../server/db/schema/index";
import { PASSWORD, seedCompany } from "./fixtures";
import { startAppProcess, type AppProcess } from "./app-process";
import { signInOverHttp, type HttpSession } from "./http-session";
import type { OwnCluster } from "./own-cluster";

export interface FaultFixture {
  /** The running app; replaced by restart(). */
  app: AppProcess;
  /** Starts the app again on the same port and database (sessions live in the database). */
  restart(): Promise<AppProcess>;
  databaseUrl: string;
  tech: HttpSession;
  owner: HttpSession;
  sweepId: string;
  startedAt: Date;
  /** Reading ids stored for the sweep, read straight from the database. */
  storedIds(): Promise<string[]>;
}

export async function faultFixture(cluster: OwnCluster, env: Record<string, string> = {}): Promise<FaultFixture> {
  const databaseUrl = await cluster.createDatabase("plumeline");
  const { pool, db } = createDb(databaseUrl);
  await migrateDb(db);
  const co = await seedCompany({ db }, "Tamarack Grocers");
  const [detector] = await db
    .insert(detectors)
    .values({
      companyId: co.company.id,
      name: "Diode sniffer",
      principle: "heated-diode",
      lastCheckedOn: new Date().toISOString().slice(0, 10),
    })
    .returning();
  await pool.end();

  const app = await startAppProcess({ DATABASE_URL: databaseUrl, ...env });
  const owner = await signInOverHttp(app.url, co.people.owner.email, PASSWORD);
  const plan = await owner.request("POST", `/api/stores/${co.store.id}/plans/blank`, {
    width: 40,
    depth: 25,
    unit: "m",
  });
  if (plan.status !== 201) throw new Error(`blank plan: ${plan.status} ${await plan.text()}`);
  const planId = (await plan.json()).id;
  const tech = await signInOverHttp(app.url, co.people.technician.email, PASSWORD);
  const startedAt = new Date(Date.now() - 60_000);
  const sweep = await tech.request("POST", `/api/stores/${co.store.id}/sweeps`, {
    id: crypto.randomUUID(),
    planId,
    detectorId: detector.id,
    fans: "running",
    defrost: false,
    startedAt: startedAt.toISOString(),
  });
  if (sweep.status !== 201) throw new Error(`sweep: ${sweep.status} ${await sweep.text()}`);
  const sweepId = (await sweep.json()).id;
  const fixture: FaultFixture = {
    app,
    async restart() {
      fixture.app = await startAppProcess({ DATABASE_URL: databaseUrl, ...env }, fixture.app.port);
      return fixture.app;
    },
    databaseUrl,
    tech,
    owner,
    sweepId,
    startedAt,
    async storedIds() {
      const c = new pg.Client({ connectionString: databaseUrl });
      await c.connect();
      try {
        const { rows } = await c.query("select id from readings where sweep_id = $1", [sweepId]);
        return rows.map((r) => r.id as string);
      } finally {
        await c.end();
      }
    },
  };
  return fixture;
}
