import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { arrayContains, eq } from "drizzle-orm";
import { agentFor, createTestApp, drainMail, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import { companies, companySignups, outboxMessages } from "../../db/schema/index";

let t: TestApp;
let existing: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  existing = await seedCompany(t.ctx, "Larchmont Refrigeration");
});
afterAll(() => t.close());

const form = (email: string) => ({
  companyName: "Fairbrook Cold Service",
  name: "Mara Lindqvist",
  email,
  password: "a long enough secret",
  ruleProfile: "eu-fgas",
  lengthUnit: "m",
  massUnit: "kg",
  numberFormat: "1 234,5",
});

/** The mail goes through the outgoing queue: send what waits, then wait for the fake server to file it. */
async function mailTo(address: string) {
  await drainMail(t);
  // Up to 20 s for the fake server to file it: a loaded machine, not a rule of the app.
  for (let i = 0; i < 400; i++) {
    const [m] = await t.ctx.db
      .select()
      .from(outboxMessages)
      .where(arrayContains(outboxMessages.to, [address]));
    if (m) return m;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no mail to ${address}`);
}

describe("company sign-up", () => {
  it("opens a company only once its owner confirms the e-mail, with the chosen rules and units", async () => {
    const visitor = await agentFor(t.app);
    const res = await visitor.post("/api/signup", form(" Mara@Fairbrook.example "));
    expect(res.status).toBe(202);
    // nothing exists until the link is opened
    expect(await t.ctx.db.select().from(companies).where(eq(companies.name, "Fairbrook Cold Service"))).toEqual([]);

    const mail = await mailTo("mara@fairbrook.example");
    expect(mail.companyId).toBeNull(); // belongs to no company: no Outbox lists it
    const token = /\/sign-up\/confirm\/([A-Za-z0-9_-]+)/.exec(mail.text)![1];

    const confirmed = await visitor.post("/api/signup/confirm", { token });
    expect(confirmed.status).toBe(200);
    expect(confirmed.body.user.email).toBe("mara@fairbrook.example");
    expect(confirmed.body.memberships).toEqual([
      { companyId: confirmed.body.activeCompanyId, companyName: "Fairbrook Cold Service", role: "owner" },
    ]);
    expect(confirmed.body.units).toEqual({ length: "m", mass: "kg", number: "1 234,5" });
    const [company] = await t.ctx.db.select().from(companies).where(eq(companies.name, "Fairbrook Cold Service"));
    expect(company).toMatchObject({ ruleProfile: "eu-fgas", lengthUnit: "m", massUnit: "kg", numberFormat: "1 234,5" });

    // the link works once; the owner signs in with the password chosen on the form
    expect((await visitor.post("/api/signup/confirm", { token })).body.error.code).toBe("invalid_token");
    const again = await agentFor(t.app);
    const signIn = await again.post("/api/auth/sign-in", {
      email: "mara@fairbrook.example",
      password: "a long enough secret",
    });
    expect(signIn.status).toBe(200);
  });

  it("answers an address that has an account the same way, and mails it a sign-in hint instead", async () => {
    const address = existing.people.owner.email;
    const res = await (await agentFor(t.app)).post("/api/signup", form(address));
    expect(res.status).toBe(202);
    expect(res.body).toEqual({ ok: true });
    const mail = await mailTo(address);
    expect(mail.subject).toBe("You already have a Plumeline account");
    expect(await t.ctx.db.select().from(companySignups).where(eq(companySignups.email, address))).toEqual([]);
    // the existing account is untouched
    const signIn = await (await agentFor(t.app)).post("/api/auth/sign-in", { email: address, password: PASSWORD });
    expect(signIn.status).toBe(200);
  });

  it("limits sign-ups for one address to three an hour, with a clear wait", async () => {
    const address = "busy@fairbrook.example";
    for (let i = 0; i < 3; i++)
      expect((await (await agentFor(t.app)).post("/api/signup", form(address))).status).toBe(202);
    const fourth = await (await agentFor(t.app)).post("/api/signup", form(address));
    expect(fourth.status).toBe(429);
    expect(fourth.body.error.message).toMatch(/Too many sign-ups for this address\. Wait \d+ minutes? and try again\./);
  });

  it("names each field that needs fixing", async () => {
    const res = await (await agentFor(t.app)).post("/api/signup", {
      ...form("not-an-address"),
      companyName: " ",
      password: "short",
      ruleProfile: "martian",
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["companyName", "email", "password", "ruleProfile"]);
    expect((await (await agentFor(t.app)).post("/api/signup/confirm", { token: "x" })).status).toBe(400);
  });
});
