import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { desc, eq } from "drizzle-orm";
import { outboxMessages } from "../../db/schema/index";
import { agentFor, createTestApp, drainMail, type Agent, type TestApp, signIn } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import type { Role } from "#core/domain/roles";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Fernway Grocers");
  other = await seedCompany(t.ctx, "Tidewater Provisions");
});
afterAll(() => t.close());

const signedIn = (role: Role, company = co): Promise<Agent> => signIn(t.app, company.people[role]);

async function latestMailTo(email: string) {
  await drainMail(t);
  const [m] = await t.ctx.db
    .select()
    .from(outboxMessages)
    .where(eq(outboxMessages.to, [email]))
    .orderBy(desc(outboxMessages.receivedAt))
    .limit(1);
  return m;
}

describe("team: who may do what", () => {
  const readers: Role[] = ["owner", "lead-tech", "technician", "engineer"];
  it.each(readers)("%s can read the team", async (role) => {
    const res = await (await signedIn(role)).get("/api/team");
    expect(res.status).toBe(200);
    expect(res.body.members).toHaveLength(5);
  });

  it("a store contact cannot read the team", async () => {
    expect((await (await signedIn("store-contact")).get("/api/team")).status).toBe(403);
  });

  const nonOwners: Role[] = ["lead-tech", "technician", "engineer", "store-contact"];
  it.each(nonOwners)("%s cannot invite, change roles, remove members or edit settings", async (role) => {
    const a = await signedIn(role);
    expect((await a.post("/api/team/invitations", { email: "new@fernway.test", role: "technician" })).status).toBe(403);
    expect((await a.patch(`/api/team/members/${co.people.technician.membershipId}`, { role: "engineer" })).status).toBe(
      403,
    );
    expect((await a.delete(`/api/team/members/${co.people.technician.membershipId}`)).status).toBe(403);
    expect(
      (
        await a.put("/api/company/settings", {
          name: "X",
          lengthUnit: "m",
          massUnit: "kg",
          ruleProfile: "us-federal",
          leakRateMethod: "annualizing",
          detectorCheckIntervalDays: 30,
        })
      ).status,
    ).toBe(403);
    expect((await a.get("/api/company/settings")).status).toBe(200);
  });

  it("the owner changes a role and cannot demote or remove the last owner", async () => {
    const a = await signedIn("owner");
    const res = await a.patch(`/api/team/members/${co.people.technician.membershipId}`, { role: "lead-tech" });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe("lead-tech");
    await a.patch(`/api/team/members/${co.people.technician.membershipId}`, { role: "technician" });
    const demote = await a.patch(`/api/team/members/${co.people.owner.membershipId}`, { role: "engineer" });
    expect(demote.status).toBe(409);
    expect((await a.delete(`/api/team/members/${co.people.owner.membershipId}`)).status).toBe(409);
  });

  it("a store contact's scope must name the company's own stores", async () => {
    const a = await signedIn("owner");
    const none = await a.patch(`/api/team/members/${co.people["store-contact"].membershipId}`, {
      role: "store-contact",
      storeIds: [],
    });
    expect(none.status).toBe(400);
    expect(none.body.error.fields.storeIds).toMatch(/at least one store/);
    const foreign = await a.patch(`/api/team/members/${co.people["store-contact"].membershipId}`, {
      role: "store-contact",
      storeIds: [other.store.id],
    });
    expect(foreign.status).toBe(400);
    expect(foreign.body.error.fields.storeIds).toMatch(/not in this company/);
  });

  it("the owner updates company settings, with field errors for bad values", async () => {
    const a = await signedIn("owner");
    const bad = await a.put("/api/company/settings", {
      name: "",
      lengthUnit: "yards",
      massUnit: "kg",
      ruleProfile: "us-federal",
      leakRateMethod: "annualizing",
      detectorCheckIntervalDays: 0.5,
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["detectorCheckIntervalDays", "lengthUnit", "name"]);
    const good = await a.put("/api/company/settings", {
      name: "Fernway Grocers",
      lengthUnit: "ft-in",
      massUnit: "lb",
      ruleProfile: "eu-fgas",
      leakRateMethod: "rolling-average",
      detectorCheckIntervalDays: 14,
    });
    expect(good.status).toBe(200);
    expect(good.body.ruleProfile).toBe("eu-fgas");
    expect((await a.get("/api/company/settings")).body.detectorCheckIntervalDays).toBe(14);
  });
});

describe("store contacts", () => {
  it("see only the stores named on their membership", async () => {
    const contact = await (await signedIn("store-contact")).get("/api/stores");
    expect(contact.body.stores.map((s: { id: string }) => s.id)).toEqual([co.store.id]);
    const tech = await (await signedIn("technician")).get("/api/stores");
    expect(tech.body.stores).toHaveLength(2);
  });
});

describe("cross-company isolation", () => {
  it("never shows or changes another company's data", async () => {
    const a = await signedIn("owner", other);
    const team = await a.get("/api/team");
    expect(team.body.members.every((m: { email: string }) => m.email.endsWith("tidewaterprovisions.test"))).toBe(true);
    expect((await a.patch(`/api/team/members/${co.people.technician.membershipId}`, { role: "engineer" })).status).toBe(
      404,
    );
    expect((await a.delete(`/api/team/members/${co.people.technician.membershipId}`)).status).toBe(404);
    expect((await a.post("/api/auth/switch-company", { companyId: co.company.id })).status).toBe(404);
    const stores = await a.get("/api/stores");
    expect(stores.body.stores.map((s: { id: string }) => s.id)).not.toContain(co.store.id);
  });
});

describe("invitations", () => {
  it("e-mails a link through the fake SMTP server that creates the account and joins the company", async () => {
    const owner = await signedIn("owner");
    const sent = await owner.post("/api/team/invitations", { email: "Newcomer@Fernway.test", role: "technician" });
    expect(sent.status).toBe(201);
    expect(sent.body.email).toBe("newcomer@fernway.test");
    const mail = await latestMailTo("newcomer@fernway.test");
    expect(mail.subject).toBe("You are invited to Fernway Grocers on Plumeline");
    expect(mail.companyId).toBe(co.company.id);
    const token = mail.text.match(/\/invite\/([A-Za-z0-9_-]+)/)?.[1];
    expect(token).toBeTruthy();

    const guest = await agentFor(t.app);
    const preview = await guest.get(`/api/invitations/${token}`);
    expect(preview.body).toEqual({
      companyName: "Fernway Grocers",
      email: "newcomer@fernway.test",
      role: "technician",
      hasAccount: false,
    });
    const weak = await guest.post(`/api/invitations/${token}/accept`, { password: "short" });
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields).toMatchObject({
      name: "is required",
      password: expect.stringMatching(/at least 10/),
    });
    const accepted = await guest.post(`/api/invitations/${token}/accept`, {
      name: "Nia Newcomer",
      password: "a long enough secret",
    });
    expect(accepted.status).toBe(200);
    expect(accepted.body.activeCompanyId).toBe(co.company.id);
    expect(
      (await guest.get("/api/team")).body.members.some((m: { email: string }) => m.email === "newcomer@fernway.test"),
    ).toBe(true);
    expect((await agentFor(t.app).then((g) => g.get(`/api/invitations/${token}`))).status).toBe(404);
  });

  it("lets an existing user of another company join with their own password", async () => {
    const owner = await signedIn("owner");
    const email = other.people.engineer.email;
    await owner.post("/api/team/invitations", { email, role: "engineer" });
    const token = (await latestMailTo(email)).text.match(/\/invite\/([A-Za-z0-9_-]+)/)?.[1];
    const guest = await agentFor(t.app);
    expect((await guest.get(`/api/invitations/${token}`)).body.hasAccount).toBe(true);
    expect((await guest.post(`/api/invitations/${token}/accept`, { password: "wrong wrong" })).status).toBe(401);
    const joined = await guest.post(`/api/invitations/${token}/accept`, { password: PASSWORD });
    expect(joined.body.memberships).toHaveLength(2);
    const switched = await guest.post("/api/auth/switch-company", { companyId: other.company.id });
    expect(switched.body.activeCompanyId).toBe(other.company.id);
  });

  it("refuses bad invitations with field errors", async () => {
    const owner = await signedIn("owner");
    const res = await owner.post("/api/team/invitations", { email: "x", role: "boss" });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["email", "role"]);
    const dup = await owner.post("/api/team/invitations", { email: co.people.engineer.email, role: "engineer" });
    expect(dup.status).toBe(409);
    const contact = await owner.post("/api/team/invitations", {
      email: "contact2@fernway.test",
      role: "store-contact",
      storeIds: [],
    });
    expect(contact.body.error.fields.storeIds).toMatch(/at least one store/);
  });

  it("can be revoked", async () => {
    const owner = await signedIn("owner");
    const sent = await owner.post("/api/team/invitations", { email: "later@fernway.test", role: "engineer" });
    expect((await owner.delete(`/api/team/invitations/${sent.body.id}`)).status).toBe(204);
    const team = await owner.get("/api/team");
    expect(team.body.invitations.some((i: { id: string }) => i.id === sent.body.id)).toBe(false);
  });
});

describe("outbox", () => {
  it("is for owners and engineers only, and shows only the company's own mail", async () => {
    expect((await (await signedIn("technician")).get("/api/outbox")).status).toBe(403);
    const res = await (await signedIn("engineer")).get("/api/outbox");
    expect(res.status).toBe(200);
    expect(res.body.messages.length).toBeGreaterThan(0);
    const theirs = await (await signedIn("owner", other)).get("/api/outbox");
    expect(theirs.body.messages.some((m: { subject: string }) => m.subject.includes("Fernway"))).toBe(false);
  });
});
