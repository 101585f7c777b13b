import { afterAll, beforeAll, describe, expect, it } from "vitest";
import bcrypt from "bcryptjs";
import { createApp } from "../../app";
import { agentFor, createTestApp, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import { dummyHashFor } from "./auth.service";
import { readEnv } from "../../env";

let t: TestApp;
let acme: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp({ loginRateLimit: 3, loginRateWindowMs: 60_000 });
  acme = await seedCompany(t.ctx, "Bramble Foods");
});
afterAll(() => t.close());

const wrong = (email: string) => ({ email, password: "not the password" });

describe("sign-in attempt limit", () => {
  it("counts the address as the contract reads it: padding and capitals are the same address", async () => {
    const email = acme.people.technician.email;
    const a = await agentFor(t.app);
    for (const variant of [email, `  ${email}`, `${email.toUpperCase()} `])
      expect((await a.post("/api/auth/sign-in", wrong(variant))).status).toBe(401);
    const blocked = await a.post("/api/auth/sign-in", wrong(`\t ${email}  `));
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe("rate_limited");
  });

  it("does not count successful sign-ins", async () => {
    const email = acme.people.engineer.email;
    const a = await agentFor(t.app);
    for (let i = 0; i < 5; i++)
      expect((await a.post("/api/auth/sign-in", { email, password: PASSWORD })).status).toBe(200);
    for (let i = 0; i < 3; i++) expect((await a.post("/api/auth/sign-in", wrong(email))).status).toBe(401);
    expect((await a.post("/api/auth/sign-in", { email, password: PASSWORD })).status).toBe(429);
  });

  it("keeps its counters in PostgreSQL, shared by every process on the database", async () => {
    const email = acme.people.owner.email;
    const first = await agentFor(t.app);
    for (let i = 0; i < 3; i++) expect((await first.post("/api/auth/sign-in", wrong(email))).status).toBe(401);
    // A second app on the same database stands in for another process or a restart: no memory is shared.
    const other = await agentFor(createApp({ ...t.ctx }));
    expect((await other.post("/api/auth/sign-in", wrong(email))).status).toBe(429);
    const { rows } = await t.ctx.pool.query("select count(*)::int as n from rate_limit_hits");
    expect(rows[0].n).toBeGreaterThan(0);
  });

  it("does not believe X-Forwarded-For when no proxy is configured", async () => {
    const email = acme.people["lead-tech"].email;
    const a = await agentFor(t.app);
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++)
      statuses.push(
        (
          await a.agent
            .post("/api/auth/sign-in")
            .set("X-CSRF-Token", a.csrf)
            .set("X-Forwarded-For", `203.0.113.${i}`)
            .send(wrong(email))
        ).status,
      );
    expect(statuses).toEqual([401, 401, 401, 429, 429]);
  });

  it("believes X-Forwarded-For from a configured proxy", async () => {
    const proxied = await createTestApp({ loginRateLimit: 2, loginRateWindowMs: 60_000, trustProxy: ["loopback"] });
    try {
      const c = await seedCompany(proxied.ctx, "Quill Grocers");
      const a = await agentFor(proxied.app);
      const from = (ip: string) =>
        a.agent
          .post("/api/auth/sign-in")
          .set("X-CSRF-Token", a.csrf)
          .set("X-Forwarded-For", ip)
          .send(wrong(c.people.owner.email));
      expect((await from("203.0.113.7")).status).toBe(401);
      expect((await from("203.0.113.7")).status).toBe(401);
      expect((await from("203.0.113.7")).status).toBe(429);
      // Another client behind the proxy has its own count for the same address.
      expect((await from("198.51.100.9")).status).toBe(401);
    } finally {
      await proxied.close();
    }
  });
});

describe("unknown addresses", () => {
  it("are compared against a dummy hash made at the configured bcrypt cost", async () => {
    for (const cost of [4, 6]) expect(bcrypt.getRounds(await dummyHashFor(cost))).toBe(cost);
  });
});

describe("TRUST_PROXY", () => {
  const base = { DATABASE_URL: "postgres://x@127.0.0.1/x" };
  it("is off unless configured, and takes a hop count or a list of addresses", () => {
    expect(readEnv(base).TRUST_PROXY).toBe(false);
    expect(readEnv({ ...base, TRUST_PROXY: "false" }).TRUST_PROXY).toBe(false);
    expect(readEnv({ ...base, TRUST_PROXY: "1" }).TRUST_PROXY).toBe(1);
    expect(readEnv({ ...base, TRUST_PROXY: "loopback, 10.0.0.0/8,2001:db8::1" }).TRUST_PROXY).toEqual([
      "loopback",
      "10.0.0.0/8",
      "2001:db8::1",
    ]);
  });
  it("refuses anything else with a clear message", () => {
    expect(() => readEnv({ ...base, TRUST_PROXY: "true" })).toThrow(/TRUST_PROXY/);
    expect(() => readEnv({ ...base, TRUST_PROXY: "10.0.0.300" })).toThrow(/TRUST_PROXY/);
  });
});
