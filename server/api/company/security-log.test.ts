import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, signIn, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import { systems } from "../../db/schema/index";

let t: TestApp;
let acme: Awaited<ReturnType<typeof seedCompany>>;
let rival: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  acme = await seedCompany(t.ctx, "Bramble Foods");
  rival = await seedCompany(t.ctx, "Thistle Market");
});
afterAll(() => t.close());

type Event = { kind: string; who: string | null; by: string | null; detail: Record<string, unknown>; at: string };

describe("the security log", () => {
  it("records sign-ins, failed sign-ins, password and role changes and exports, for the owner to read", async () => {
    const tech = acme.people.technician;
    const anon = await agentFor(t.app);
    await anon.post("/api/auth/sign-in", { email: tech.email, password: "not the password" });
    const techAgent = await signIn(t.app, tech);
    await techAgent.post("/api/profile/password", { currentPassword: PASSWORD, newPassword: "a new passphrase" });
    const owner = await signIn(t.app, acme.people.owner);
    await owner.patch(`/api/team/members/${acme.people.engineer.membershipId}`, { role: "lead-tech", storeIds: [] });
    const [sys] = await t.ctx.db
      .insert(systems)
      .values({
        companyId: acme.company.id,
        storeId: acme.store.id,
        name: "Rack A",
        refrigerantId: "R-448A",
        fullChargeKg: 100,
        applianceType: "commercial-refrigeration",
      })
      .returning();
    const engineer = await signIn(t.app, acme.people.engineer);
    expect((await engineer.get(`/api/systems/${sys.id}/records.csv`)).status).toBe(200);

    const res = await owner.get("/api/company/security-log");
    expect(res.status).toBe(200);
    const events = res.body.events as Event[];
    const kinds = (kind: string) => events.filter((e) => e.kind === kind);
    expect(kinds("sign-in-failed").some((e) => e.who === tech.email)).toBe(true);
    expect(kinds("sign-in").some((e) => e.who === tech.email)).toBe(true);
    expect(kinds("password-changed").map((e) => e.who)).toContain(tech.email);
    const role = kinds("role-changed").find((e) => e.who === acme.people.engineer.email)!;
    expect(role.by).toBe(acme.people.owner.email);
    expect(role.detail).toMatchObject({ from: "engineer", to: "lead-tech" });
    const exp = kinds("export").find((e) => e.who === acme.people.engineer.email)!;
    expect(exp.detail).toMatchObject({ what: "records.csv", systemId: sys.id });
    // Newest first.
    expect([...events].sort((x, y) => y.at.localeCompare(x.at)).map((e) => e.at)).toEqual(events.map((e) => e.at));
  });

  it("is the owner's only, and never shows another company's events", async () => {
    await signIn(t.app, rival.people.technician);
    for (const role of ["lead-tech", "technician", "engineer", "store-contact"] as const)
      expect(
        (
          await (
            await signIn(t.app, acme.people[role], role === "technician" ? "a new passphrase" : PASSWORD)
          ).get("/api/company/security-log")
        ).status,
        role,
      ).toBe(403);
    const mine = await (await signIn(t.app, acme.people.owner)).get("/api/company/security-log");
    const text = JSON.stringify(mine.body);
    for (const p of Object.values(rival.people)) expect(text).not.toContain(p.email);
    expect((await (await agentFor(t.app)).get("/api/company/security-log")).status).toBe(401);
  });
});
