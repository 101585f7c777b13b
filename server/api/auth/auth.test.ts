import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { createApp } from "../../app";
import { outboxMessages } from "../../db/schema/index";
import { agentFor, createTestApp, drainMail, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import { waitForMail } from "../../../tests/helpers/mail-wait";

let t: TestApp;
let acme: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  acme = await seedCompany(t.ctx, "Bramble Foods");
});
afterAll(() => t.close());

describe("sign-in", () => {
  it("signs in with the right password and reports the membership", async () => {
    const a = await agentFor(t.app);
    const res = await a.post("/api/auth/sign-in", { email: acme.people.owner.email, password: PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user.email).toBe(acme.people.owner.email);
    expect(res.body.activeCompanyId).toBe(acme.company.id);
    expect(res.body.memberships).toEqual([{ companyId: acme.company.id, companyName: "Bramble Foods", role: "owner" }]);
    const me = await a.get("/api/auth/session");
    expect(me.body.user.id).toBe(acme.people.owner.userId);
  });

  it("refuses a wrong password and an unknown e-mail alike", async () => {
    const a = await agentFor(t.app);
    const wrong = await a.post("/api/auth/sign-in", { email: acme.people.owner.email, password: "not it at all" });
    const unknown = await a.post("/api/auth/sign-in", { email: "nobody@bramble.test", password: PASSWORD });
    for (const res of [wrong, unknown]) {
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe("invalid_credentials");
    }
    expect((await a.get("/api/auth/session")).body.user).toBeNull();
  });

  it("gives field errors for missing and malformed input", async () => {
    const a = await agentFor(t.app);
    const res = await a.post("/api/auth/sign-in", { email: "not-an-email", password: 12 });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("validation_failed");
    expect(res.body.error.fields.email).toMatch(/valid e-mail/);
    expect(res.body.error.fields.password).toBeTruthy();
    const missing = await a.post("/api/auth/sign-in", {});
    expect(Object.keys(missing.body.error.fields).sort()).toEqual(["email", "password"]);
    const long = await a.post("/api/auth/sign-in", { email: `${"x".repeat(250)}@a.test`, password: "y" });
    expect(long.body.error.fields.email).toMatch(/at most 254/);
  });

  it("rotates the session id at sign-in (no session fixation)", async () => {
    const agent = request.agent(t.app);
    const first = await agent.get("/api/auth/session");
    const before = first.headers["set-cookie"]?.[0]?.split(";")[0];
    const res = await agent
      .post("/api/auth/sign-in")
      .set("X-CSRF-Token", first.body.csrfToken)
      .send({ email: acme.people.owner.email, password: PASSWORD });
    const after = res.headers["set-cookie"]?.[0]?.split(";")[0];
    expect(before).toBeTruthy();
    expect(after).toBeTruthy();
    expect(after).not.toBe(before);
    expect(res.headers["set-cookie"][0]).toMatch(/HttpOnly/);
    expect(res.headers["set-cookie"][0]).toMatch(/SameSite=Lax/);
    expect(res.body.csrfToken).not.toBe(first.body.csrfToken);
  });

  it("signs out", async () => {
    const a = await agentFor(t.app);
    await a.post("/api/auth/sign-in", { email: acme.people.owner.email, password: PASSWORD });
    const out = await a.post("/api/auth/sign-out");
    expect(out.body.user).toBeNull();
    expect((await a.get("/api/team")).status).toBe(401);
  });
});

describe("CSRF", () => {
  it("rejects a state-changing request without the token, and with a wrong one", async () => {
    const agent = request.agent(t.app);
    await agent.get("/api/auth/session");
    const none = await agent.post("/api/auth/sign-in").send({ email: acme.people.owner.email, password: PASSWORD });
    expect(none.status).toBe(403);
    expect(none.body.error.code).toBe("csrf_failed");
    const wrong = await agent
      .post("/api/auth/sign-in")
      .set("X-CSRF-Token", "x".repeat(43))
      .send({ email: acme.people.owner.email, password: PASSWORD });
    expect(wrong.status).toBe(403);
  });

  it("rejects a write by a signed-in member that lacks the token", async () => {
    const a = await agentFor(t.app);
    await a.post("/api/auth/sign-in", { email: acme.people.owner.email, password: PASSWORD });
    const res = await a.agent.put("/api/company/settings").send({ name: "Hijacked" });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("csrf_failed");
  });
});

describe("sessions live in PostgreSQL", () => {
  it("survive a server restart", async () => {
    const a = await agentFor(t.app);
    await a.post("/api/auth/sign-in", { email: acme.people.engineer.email, password: PASSWORD });
    const cookie = (await a.get("/api/auth/session")).request.cookies;
    // A new app on the same database stands in for the restarted process: no memory is shared.
    const restarted = createApp({ ...t.ctx });
    const res = await request(restarted).get("/api/auth/session").set("Cookie", cookie);
    expect(res.body.user?.email).toBe(acme.people.engineer.email);
  });
});

describe("rate limit", () => {
  it("stops repeated sign-in attempts with a clear message", async () => {
    const limited = await createTestApp({ loginRateLimit: 3, loginRateWindowMs: 60_000 });
    try {
      const c = await seedCompany(limited.ctx, "Quill Grocers");
      const a = await agentFor(limited.app);
      for (let i = 0; i < 3; i++) {
        expect(
          (await a.post("/api/auth/sign-in", { email: c.people.owner.email, password: "wrong password" })).status,
        ).toBe(401);
      }
      const blocked = await a.post("/api/auth/sign-in", { email: c.people.owner.email, password: PASSWORD });
      expect(blocked.status).toBe(429);
      expect(blocked.body.error.code).toBe("rate_limited");
      expect(blocked.body.error.message).toMatch(/Too many sign-in attempts\. Wait 1 minute/);
    } finally {
      await limited.close();
    }
  });
});

describe("password reset", () => {
  it("e-mails a one-time link that sets a new password", async () => {
    const a = await agentFor(t.app);
    const since = new Date();
    const asked = await a.post("/api/auth/password-reset", { email: acme.people.technician.email });
    expect(asked.status).toBe(202);
    const mail = await waitForMail(t.ctx, acme.people.technician.email, since);
    expect(mail.to).toEqual([acme.people.technician.email]);
    const token = mail.text.match(/reset-password\/([A-Za-z0-9_-]+)/)?.[1];
    expect(token).toBeTruthy();
    expect(
      (await a.post("/api/auth/password-reset/confirm", { token, password: "short" })).body.error.fields.password,
    ).toMatch(/at least 10/);
    expect(
      (await a.post("/api/auth/password-reset/confirm", { token, password: "a brand new passphrase" })).status,
    ).toBe(204);
    expect((await a.post("/api/auth/password-reset/confirm", { token, password: "a second passphrase" })).status).toBe(
      400,
    );
    expect(
      (await a.post("/api/auth/sign-in", { email: acme.people.technician.email, password: PASSWORD })).status,
    ).toBe(401);
    expect(
      (await a.post("/api/auth/sign-in", { email: acme.people.technician.email, password: "a brand new passphrase" }))
        .status,
    ).toBe(200);
  });

  it("answers the same for an unknown e-mail and sends nothing", async () => {
    const a = await agentFor(t.app);
    const before = (await t.ctx.db.select().from(outboxMessages)).length;
    expect((await a.post("/api/auth/password-reset", { email: "ghost@nowhere.test" })).status).toBe(202);
    await drainMail(t);
    expect((await t.ctx.db.select().from(outboxMessages)).length).toBe(before);
  });
});

describe("units", () => {
  it("follow the person's own choice, else the company default", async () => {
    const a = await agentFor(t.app);
    const signedIn = await a.post("/api/auth/sign-in", { email: acme.people["lead-tech"].email, password: PASSWORD });
    expect(signedIn.body.units).toEqual({ length: "m", mass: "kg", number: "1,234.5" });
    const own = await a.patch("/api/profile", { name: "Lead", lengthUnit: "ft-in", massUnit: null });
    expect(own.body.units).toEqual({ length: "ft-in", mass: "kg", number: "1,234.5" });
  });
});
