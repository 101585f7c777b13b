// Two app processes (the production build) on one database, as behind a load balancer: a session
// made on one is good on the other, jobs queued by one (an analysis, a report's PDF) are run by the
// other, and the sign-in and sync limits count across both (they live in PostgreSQL). Own cluster,
// loopback, bounded in time.
import pg from "pg";
import { afterAll, beforeAll, expect, it } from "vitest";
import { startOwnCluster, type OwnCluster } from "../helpers/own-cluster";
import { faultFixture, type FaultFixture } from "../helpers/fault-fixture";
import { startAppProcess, type AppProcess } from "../helpers/app-process";
import { caseWalkReadings } from "../helpers/sweep-walk";

let cluster: OwnCluster;
let f: FaultFixture;
let other: AppProcess;
const LIMIT = { LOGIN_RATE_LIMIT: "3", SYNC_RATE_LIMIT: "1000" };

beforeAll(async () => {
  cluster = await startOwnCluster("two-procs");
  // The first process queues jobs but runs none (RUN_JOBS=false): whatever runs them is the second.
  f = await faultFixture(cluster, { ...LIMIT, RUN_JOBS: "false" });
  other = await startAppProcess({ DATABASE_URL: f.databaseUrl, ...LIMIT, JOB_POLL_INTERVAL_S: "0.5" });
}, 120_000);

afterAll(async () => {
  for (const app of [f?.app, other])
    if (app?.alive()) {
      app.kill("SIGKILL");
      await app.exited;
    }
  await cluster?.destroy();
}, 60_000);

/** The same signed-in session, sent to the other process. */
function onOther(path: string, method = "GET", body?: unknown) {
  return fetch(other.url + path, {
    method,
    headers: f.tech.writeHeaders(),
    body: body === undefined ? undefined : JSON.stringify(body),
  });
}

it("a session made on one process acts on the other", async () => {
  const readings = caseWalkReadings(f.startedAt).map((r) => ({ ...r, id: crypto.randomUUID() }));
  const res = await onOther(`/api/sweeps/${f.sweepId}/readings`, "POST", { readings });
  expect(res.status, await res.clone().text()).toBe(200);
  expect((await res.json()).stored).toHaveLength(readings.length);
  // Read back through the first process: the same rows.
  const back = await f.tech.request("GET", `/api/sweeps/${f.sweepId}/readings`);
  expect((await back.json()).readings).toHaveLength(readings.length);
}, 60_000);

it("an analysis queued by the process that runs no jobs is run by the other, and the first answers it", async () => {
  const res = await f.owner.request("GET", `/api/sweeps/${f.sweepId}/analysis?wait=true`);
  expect(res.status, await res.clone().text()).toBe(200);
  const body = await res.json();
  expect(body).toMatchObject({ sweepId: f.sweepId, stale: false });
  expect(body.candidates.length).toBeGreaterThan(0);
  const c = new pg.Client({ connectionString: f.databaseUrl });
  await c.connect();
  try {
    const { rows } = await c.query("select state from pgboss.job where name = 'analysis' and data->>'sweepId' = $1", [
      f.sweepId,
    ]);
    expect(rows.map((r) => r.state)).toEqual(["completed"]);
  } finally {
    await c.end();
  }
}, 120_000);

it("a report sent to the process that runs no jobs answers at once; the other makes its PDF and it is mailed", async () => {
  const res = await f.owner.request("POST", `/api/sweeps/${f.sweepId}/report/send`, {
    addresses: ["buyer@tamarack.test"],
  });
  expect(res.status, await res.clone().text()).toBe(201);
  const sent = await res.json();
  expect(sent.delivery.state).toBe("preparing");
  let send: { bytes: number | null; delivery: { state: string } } | undefined;
  for (const by = Date.now() + 90_000; Date.now() < by; await new Promise((r) => setTimeout(r, 500))) {
    const list = await (await f.owner.request("GET", `/api/sweeps/${f.sweepId}/report/sends`)).json();
    send = list.sends.find((s: { id: string }) => s.id === sent.id);
    if (send?.delivery.state === "sent" || send?.delivery.state === "failed") break;
  }
  expect(send?.delivery.state).toBe("sent");
  expect(send?.bytes).toBeGreaterThan(10_000);
  const c = new pg.Client({ connectionString: f.databaseUrl });
  await c.connect();
  try {
    const { rows } = await c.query("select state from pgboss.job where name = 'report-pdf' and data->>'sendId' = $1", [
      sent.id,
    ]);
    expect(rows.map((r) => r.state)).toEqual(["completed"]);
  } finally {
    await c.end();
  }
}, 120_000);

it("the sign-in limit holds across both processes", async () => {
  const email = "nobody-in-particular@tamarack.test";
  const statuses: number[] = [];
  for (const base of [f.app.url, other.url, f.app.url, other.url]) {
    const session = await fetch(`${base}/api/auth/session`);
    const cookie = session.headers
      .getSetCookie()
      .find((x) => x.startsWith("plumeline.sid="))!
      .split(";")[0];
    const { csrfToken } = await session.json();
    const res = await fetch(`${base}/api/auth/sign-in`, {
      method: "POST",
      headers: { cookie, "x-csrf-token": csrfToken, "content-type": "application/json" },
      body: JSON.stringify({ email, password: "not the password" }),
    });
    statuses.push(res.status);
  }
  // LOGIN_RATE_LIMIT=3 per client and address: three refusals, then the limit, wherever asked.
  expect(statuses).toEqual([401, 401, 401, 429]);
}, 60_000);
