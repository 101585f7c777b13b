import { afterAll, beforeAll, expect, it } from "vitest";
import request from "supertest";
import pg from "pg";
import { createTestApp, type TestApp } from "../../../tests/helpers/test-app";
import { freePort } from "../../../tests/helpers/own-cluster";
import { isDatabaseUnavailable } from "../../db/unavailable";

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
  t.ctx.lifecycle = { draining: false };
});
afterAll(() => t.close());

it("/healthz and its alias /api/health answer JSON without a session or the client page", async () => {
  for (const path of ["/healthz", "/api/health"]) {
    const res = await request(t.app).get(path);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toMatch(/json/);
    expect(res.body).toEqual({ ok: true, status: "alive" });
    expect(res.headers["set-cookie"]).toBeUndefined();
  }
});

it("/readyz checks the database and reports not-ready while draining, closing the connection", async () => {
  expect((await request(t.app).get("/readyz")).body).toEqual({ ok: true, status: "ready", database: "up" });
  t.ctx.lifecycle!.draining = true;
  try {
    const res = await request(t.app).get("/readyz");
    expect(res.status).toBe(503);
    expect(res.body).toMatchObject({ ok: false, status: "draining" });
    const other = await request(t.app).get("/api/auth/session");
    expect(other.headers.connection).toBe("close");
  } finally {
    t.ctx.lifecycle!.draining = false;
  }
});

it("tells a database that cannot be reached or was shut down from an ordinary error", async () => {
  // A refused connection: nothing listens on this port.
  const refused = new pg.Client({ connectionString: `postgres://postgres@127.0.0.1:${await freePort()}/x` });
  const e1 = await refused.connect().catch((e: unknown) => e);
  expect(isDatabaseUnavailable(e1)).toBe(true);
  // A backend terminated by an administrator (SQLSTATE 57P01), wrapped by Drizzle as `cause`.
  const victim = new pg.Client({ connectionString: t.database.url });
  victim.on("error", () => {});
  await victim.connect();
  const pid = (await victim.query("select pg_backend_pid() as pid")).rows[0].pid;
  await t.database.pool.query("select pg_terminate_backend($1)", [pid]);
  const e2 = await victim.query("select 1").catch((e: unknown) => e);
  expect(isDatabaseUnavailable({ message: "Failed query: begin", cause: e2 })).toBe(true);
  await victim.end().catch(() => {});
  // A bug or bad data is not an outage.
  const e3 = await t.database.pool.query("select * from no_such_table").catch((e: unknown) => e);
  expect(isDatabaseUnavailable(e3)).toBe(false);
  expect(isDatabaseUnavailable(new Error("boom"))).toBe(false);
});
