import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, type Agent, type TestApp, signInOnce } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { systems } from "../../db/schema/index";
import { addMonths } from "#core/domain/dates/calendar-date";
import { localDateOf } from "#core/domain/dates/time-zone";
import type { Role } from "#core/domain/roles";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
const signInOnceAs = signInOnce(() => t.app);

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Larkspur Pantry");
});
afterAll(() => t.close());

const signedIn = (role: Role): Promise<Agent> => signInOnceAs(co.people[role]);
const lb = (value: number) => ({ value, unit: "lb" });

async function newSystem(name: string) {
  const res = await (await signedIn("lead-tech")).post(`/api/stores/${co.store.id}/systems`, {
    name,
    refrigerantId: "R-404A",
    fullCharge: lb(200),
    applianceType: "commercial-refrigeration",
    automaticLeakDetection: false,
    inServiceOn: "2026-01-01",
  });
  expect(res.status).toBe(201);
  return res.body.id as string;
}

const settings = (ruleProfile: string) => ({
  name: "Larkspur Pantry",
  lengthUnit: "m",
  massUnit: "lb",
  ruleProfile,
  leakRateMethod: "annualizing",
  detectorCheckIntervalDays: 30,
});

describe("no record is ever lost (docs/decisions/0040-no-record-is-lost.md, 0124)", () => {
  it("refuses to delete a system with records, retires it with its day and reason, and keeps every record readable", async () => {
    const id = await newSystem("Rack C (low temp)");
    const tech = await signedIn("technician");
    const add = await tech.post(`/api/systems/${id}/charge-additions`, {
      addedOn: "2026-03-02",
      amount: lb(12),
      reason: "Topped up after low-level alarm",
    });
    expect(add.status).toBe(201);
    expect(
      (await tech.post(`/api/systems/${id}/leak-checks`, { checkedOn: "2026-03-20", leakFound: false })).status,
    ).toBe(201);

    const lead = await signedIn("lead-tech");
    const listed = await lead.get(`/api/stores/${co.store.id}/systems`);
    expect(listed.body.systems.find((s: { id: string }) => s.id === id).hasRecords).toBe(true);
    const del = await lead.delete(`/api/systems/${id}`);
    expect(del.status).toBe(409);
    expect(del.body.error.message).toMatch(/has records, so it cannot be deleted: retire it/);

    const retire = await lead.post(`/api/systems/${id}/retire`, {
      retiredOn: "2026-04-30",
      reasonKind: "replaced",
      reason: "by the new CO2 booster",
    });
    expect(retire.status, JSON.stringify(retire.body)).toBe(200);
    expect(retire.body.system.retired).toMatchObject({
      on: "2026-04-30",
      reasonKind: "replaced",
      reason: "by the new CO2 booster",
    });

    // Records are kept 3 years under US federal rules (docs/reference/standards.md §1, [S:R6,R7]), from the day it left service.
    const rec = await (await signedIn("engineer")).get(`/api/systems/${id}/records`);
    expect(rec.status).toBe(200);
    expect(rec.body.additions.map((a: { amountKg: number }) => a.amountKg)).toEqual([12 * 0.45359237]);
    expect(rec.body.leakChecks).toHaveLength(1);
    expect(rec.body.leakRates).toHaveLength(1);
    expect(rec.body.audit.map((a: { action: string; summary: string }) => [a.action, a.summary])).toEqual([
      [
        "system-retired",
        "Rack C (low temp) retired: left service on 2026-04-30; Replaced by another system (by the new CO2 booster); its records are kept",
      ],
    ]);
    expect(rec.body.retention).toMatchObject({ years: 3, keptUntil: "2029-04-30" });
    // A retired system owes no repair, test or inspection.
    expect(rec.body.due).toEqual([]);

    // Out of the store's list, listed again on request.
    const list = await lead.get(`/api/stores/${co.store.id}/systems`);
    expect(list.body.systems.map((s: { id: string }) => s.id)).not.toContain(id);
    const all = await lead.get(`/api/stores/${co.store.id}/systems?include=retired`);
    expect(all.body.systems.map((s: { id: string }) => s.id)).toContain(id);
    expect((await lead.get(`/api/stores/${co.store.id}/systems?include=everything`)).status).toBe(400);

    // Its history no longer changes: no edit, no new addition, no second retirement.
    expect((await lead.patch(`/api/systems/${id}`, { name: "Rack C2" })).status).toBe(409);
    const late = await tech.post(`/api/systems/${id}/charge-additions`, {
      addedOn: "2026-04-01",
      amount: lb(1),
      reason: "late",
    });
    expect(late.status).toBe(409);
    expect(late.body.error.message).toMatch(/was retired on 2026-04-30/);
    expect((await lead.delete(`/api/systems/${id}`)).status).toBe(409);
    expect(
      (await lead.post(`/api/systems/${id}/retire`, { retiredOn: "2026-05-01", reasonKind: "removed" })).status,
    ).toBe(409);
  });

  it("deletes a system that has no record at all", async () => {
    const id = await newSystem("Spare condensing unit");
    const lead = await signedIn("lead-tech");
    const listed = await lead.get(`/api/stores/${co.store.id}/systems`);
    expect(listed.body.systems.find((s: { id: string }) => s.id === id).hasRecords).toBe(false);
    const del = await lead.delete(`/api/systems/${id}`);
    expect(del.status).toBe(200);
    expect(del.body).toEqual({ outcome: "deleted", system: null });
    expect((await lead.get(`/api/systems/${id}`)).status).toBe(404);
  });

  it("asks the day and the reason, and names the field of each mistake; technicians may not retire", async () => {
    const id = await newSystem("Rack D");
    const lead = await signedIn("lead-tech");
    await (await signedIn("technician")).post(`/api/systems/${id}/charge-additions`, {
      addedOn: "2026-03-10",
      amount: lb(3),
      reason: "Top-up",
    });
    expect(
      (
        await (
          await signedIn("technician")
        ).post(`/api/systems/${id}/retire`, {
          retiredOn: "2026-03-10",
          reasonKind: "removed",
        })
      ).status,
    ).toBe(403);
    const refused = async (body: object) => {
      const res = await lead.post(`/api/systems/${id}/retire`, body);
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      return res.body.error.fields as Record<string, string>;
    };
    expect(await refused({ reasonKind: "removed" })).toHaveProperty("retiredOn");
    expect(await refused({ retiredOn: "2026-03-10" })).toHaveProperty("reasonKind");
    expect(await refused({ retiredOn: "2026-03-10", reasonKind: "sold" })).toHaveProperty("reasonKind");
    expect((await refused({ retiredOn: "2026-03-10", reasonKind: "other" })).reason).toBe(
      "say why the system left service",
    );
    const today = localDateOf(new Date(), co.store.timeZone);
    const future = addMonths(today, 1);
    expect((await refused({ retiredOn: future, reasonKind: "removed" })).retiredOn).toMatch(/must not be after today/);
    // In service since the day it was entered (today): a day before it is refused…
    const [row] = await t.ctx.db.select().from(systems).where(eq(systems.id, id));
    await t.ctx.db.update(systems).set({ inServiceOn: "2026-01-15" }).where(eq(systems.id, id));
    expect((await refused({ retiredOn: "2026-01-14", reasonKind: "removed" })).retiredOn).toBe(
      "must not be before the day it entered service (15 Jan 2026)",
    );
    // …and so is a day before its last record, which would leave a record after the retirement.
    expect((await refused({ retiredOn: "2026-03-09", reasonKind: "removed" })).retiredOn).toBe(
      "must not be before 10 Mar 2026, when refrigerant was added",
    );
    // A leak record counts by its latest event: found on 12 Mar, repaired on 14 Mar.
    const tech = await signedIn("technician");
    const leak = await tech.post(`/api/stores/${co.store.id}/findings`, {
      systemId: id,
      component: "flare",
      foundAt: "2026-03-12T15:00:00Z",
    });
    expect(leak.status, JSON.stringify(leak.body)).toBe(201);
    expect(
      (await tech.post(`/api/findings/${leak.body.id}/events`, { action: "confirm", on: "2026-03-13" })).status,
    ).toBe(200);
    expect(
      (await lead.post(`/api/findings/${leak.body.id}/events`, { action: "repair", on: "2026-03-14" })).status,
    ).toBe(200);
    expect((await refused({ retiredOn: "2026-03-13", reasonKind: "removed" })).retiredOn).toBe(
      "must not be before 14 Mar 2026, when a leak was repaired",
    );
    expect(row.retiredAt).toBeNull();
    // Nothing was changed by the refusals: still in service, no audit row.
    const rec = await lead.get(`/api/systems/${id}/records`);
    expect(rec.body.system.retired).toBeNull();
    expect(rec.body.audit).toEqual([]);

    const ok = await lead.post(`/api/systems/${id}/retire`, {
      retiredOn: "2026-03-14",
      reasonKind: "other",
      reason: "Unit stolen from the yard",
    });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({
      outcome: "retired",
      system: { retired: { on: "2026-03-14", reasonKind: "other", reason: "Unit stolen from the yard" } },
    });
  });

  it("a system row written without an in-service day entered service on the store's day it was created, not the UTC day", async () => {
    // 03:00 UTC on 1 March is 22:00 on 28 February in New York (EST, UTC-5): the store's day is the 28th.
    const [row] = await t.ctx.db
      .insert(systems)
      .values({
        companyId: co.company.id,
        storeId: co.store.id,
        name: "Rack F (legacy row)",
        refrigerantId: "R-404A",
        fullChargeKg: 90,
        applianceType: "commercial-refrigeration",
        createdAt: new Date("2026-03-01T03:00:00Z"),
      })
      .returning();
    const lead = await signedIn("lead-tech");
    expect((await lead.get(`/api/systems/${row.id}`)).body.inServiceOn).toBe("2026-02-28");
    // An edit that leaves the day alone does not count as changing it.
    const renamed = await lead.patch(`/api/systems/${row.id}`, { name: "Rack F" });
    expect(renamed.status, JSON.stringify(renamed.body)).toBe(200);
    expect(renamed.body.inServiceOn).toBe("2026-02-28");
    const retired = await lead.post(`/api/systems/${row.id}/retire`, {
      retiredOn: "2026-02-28",
      reasonKind: "other",
      reason: "Removed the day it was entered",
    });
    expect(retired.status, JSON.stringify(retired.body)).toBe(200);
    expect(retired.body.system.retired.on).toBe("2026-02-28");
  });

  it("the database itself refuses to delete a system with records (foreign keys restrict, never cascade)", async () => {
    const id = await newSystem("Rack E");
    const tech = await signedIn("technician");
    await tech.post(`/api/systems/${id}/leak-checks`, { checkedOn: "2026-05-04", leakFound: false });
    await expect(t.ctx.db.delete(systems).where(eq(systems.id, id))).rejects.toThrow();
    expect((await t.ctx.db.select().from(systems).where(eq(systems.id, id))).length).toBe(1);
  });

  it("keeps records 5 years under the EU profile (Regulation (EU) 2024/573 Art. 7, docs/reference/standards.md §2 [S:E8b])", async () => {
    const owner = await signedIn("owner");
    expect((await owner.put("/api/company/settings", settings("eu-fgas"))).status).toBe(200);
    const id = await newSystem("Rack F");
    await (await signedIn("technician")).post(`/api/systems/${id}/leak-checks`, {
      checkedOn: "2026-06-01",
      leakFound: false,
    });
    const retiredOn = localDateOf(new Date(), co.store.timeZone);
    expect(
      (await owner.post(`/api/systems/${id}/retire`, { retiredOn, reasonKind: "store-closed" })).body.outcome,
    ).toBe("retired");
    const rec = await owner.get(`/api/systems/${id}/records`);
    expect(rec.body.retention.years).toBe(5);
    expect(rec.body.retention.keptUntil).toBe(addMonths(retiredOn, 60));
    expect((await owner.put("/api/company/settings", settings("us-federal"))).status).toBe(200);
  });
});
