import { Writable } from "node:stream";
import pino from "pino";
import request from "supertest";
import { afterAll, beforeAll, expect, it } from "vitest";
import { createApp } from "../app";
import { createTestApp, type TestApp } from "../../tests/helpers/test-app";

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

/** The app with a logger whose JSON lines are kept. */
function appWithLog() {
  const lines: Record<string, unknown>[] = [];
  const sink = new Writable({
    write(chunk, _enc, done) {
      for (const l of String(chunk).split("\n")) if (l) lines.push(JSON.parse(l));
      done();
    },
  });
  return { app: createApp({ ...t.ctx, logger: pino({ level: "info" }, sink) }), lines };
}

it("every API request's log line carries a request id, answered as X-Request-Id, unique per request", async () => {
  const { app, lines } = appWithLog();
  const a = await request(app).get("/api/auth/session");
  const b = await request(app).get("/api/auth/session");
  const ids = [a.headers["x-request-id"], b.headers["x-request-id"]];
  // RFC 9562 UUIDs: unique across processes, unlike a per-process counter.
  for (const id of ids) expect(id).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
  expect(ids[0]).not.toBe(ids[1]);
  expect(lines.filter((l) => l.msg === "request completed").map((l) => l.reqId)).toEqual(ids);
});

it("keeps a proxy's plain X-Request-Id and replaces one that is not a plain token", async () => {
  const { app, lines } = appWithLog();
  const kept = await request(app).get("/api/auth/session").set("X-Request-Id", "edge-7f3a.42");
  expect(kept.headers["x-request-id"]).toBe("edge-7f3a.42");
  const replaced = await request(app).get("/api/auth/session").set("X-Request-Id", "not a token; has spaces");
  expect(replaced.headers["x-request-id"]).not.toBe("not a token; has spaces");
  expect(lines.map((l) => l.reqId)).toEqual(["edge-7f3a.42", replaced.headers["x-request-id"]]);
});
