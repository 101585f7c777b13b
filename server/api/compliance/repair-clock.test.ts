import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, type Agent, type TestApp, signInOnce } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import type { Role } from "#core/domain/roles";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
const signInOnceAs = signInOnce(() => t.app);

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Wrenfield Grocery");
});
afterAll(() => t.close());

const signedIn = (role: Role): Promise<Agent> => signInOnceAs(co.people[role]);
const lb = (value: number) => ({ value, unit: "lb" });

/** R-448A, 100 lb, commercial: 40 CFR 84 subpart C from 1 Jan 2026, 20 %, repair in 30 days [S:R4]. */
async function newSystem(name: string) {
  const res = await (await signedIn("lead-tech")).post(`/api/stores/${co.store.id}/systems`, {
    name,
    refrigerantId: "R-448A",
    fullCharge: lb(100),
    applianceType: "commercial-refrigeration",
    automaticLeakDetection: false,
  });
  expect(res.status).toBe(201);
  return res.body.id as string;
}

async function addCharge(systemId: string, addedOn: string, pounds: number, findingId?: string) {
  const r = await (await signedIn("technician")).post(`/api/systems/${systemId}/charge-additions`, {
    addedOn,
    amount: lb(pounds),
    reason: "Topped up after low-level alarm",
    ...(findingId ? { findingId } : {}),
  });
  expect(r.status).toBe(201);
  return r.body.records;
}

async function newFinding(systemId: string) {
  const r = await (await signedIn("technician")).post(`/api/stores/${co.store.id}/findings`, {
    systemId,
    status: "confirmed",
    component: "brazed-joint",
    foundAt: "2026-03-30T09:00:00-04:00",
  });
  expect(r.status).toBe(201);
  return r.body.id as string;
}

describe("repair clock and same-leak additions through the API", () => {
  it("keeps the first exceedance's deadline when a second exceeds before the repair (docs/decisions/0041-repair-clock.md)", async () => {
    const id = await newSystem("Rack G");
    await addCharge(id, "2026-02-01", 10);
    await addCharge(id, "2026-03-03", 5);
    const rec = await addCharge(id, "2026-03-23", 5);
    // 84.102 annualizing [S:R7]: 60.83 % on 3 Mar and 91.25 % on 23 Mar, both above 20 % [S:R4].
    expect(rec.leakRates.map((p: { exceeds: boolean }) => p.exceeds)).toEqual([false, true, true]);
    // 30 days [S:R4] from 3 Mar = 2 Apr; the 23 Mar exceedance never extends it.
    expect(rec.due.find((d: { kind: string }) => d.kind === "repair")).toMatchObject({ dueOn: "2026-04-02" });
    expect(rec.leakRates.map((p: { repairDue: string | null }) => p.repairDue)).toEqual([
      null,
      "2026-04-02",
      "2026-04-02",
    ]);
  });

  it("groups two top-ups of the same finding a day apart into one figure (docs/reference/standards.md §1 [M])", async () => {
    const id = await newSystem("Rack H");
    const finding = await newFinding(id);
    await addCharge(id, "2026-02-01", 2);
    await addCharge(id, "2026-04-01", 3, finding);
    const rec = await addCharge(id, "2026-04-02", 3, finding);
    // (3 + 3)/100 ÷ (60/365) × 100 = 36.5 % (not 3/100 ÷ (1/365) × 100 = 1,095 %).
    expect(rec.leakRates).toHaveLength(2);
    expect(rec.latest).toMatchObject({ date: "2026-04-02", days: 60 });
    expect(rec.latest.percent).toBeCloseTo(36.5, 9);
    // The group's repair clock runs from its first addition: 1 Apr + 30 days = 1 May [S:R4].
    expect(rec.due.find((d: { kind: string }) => d.kind === "repair")).toMatchObject({ dueOn: "2026-05-01" });

    // The repair (5 Apr) closes the episode; the recharge after it is a figure of its own.
    const lead = await signedIn("lead-tech");
    expect((await lead.post(`/api/findings/${finding}/events`, { action: "repair", on: "2026-04-05" })).status).toBe(
      200,
    );
    const after = await addCharge(id, "2026-04-10", 2, finding);
    // 2/100 ÷ (8/365) × 100 = 91.25 %: a new exceedance, due 10 Apr + 30 = 10 May.
    expect(after.latest).toMatchObject({ date: "2026-04-10", days: 8 });
    expect(after.latest.percent).toBeCloseTo(91.25, 9);
    expect(after.due.find((d: { kind: string }) => d.kind === "repair")).toMatchObject({ dueOn: "2026-05-10" });
  });

  it("asks for automatic leak detection on a 1,600 lb rack from its in-service day (40 CFR 84 subpart C)", async () => {
    // Required for commercial refrigeration of 1,500 lb or more [S:R4]; within 30 days of a 2026 in-service day [M].
    const res = await (await signedIn("lead-tech")).post(`/api/stores/${co.store.id}/systems`, {
      name: "Rack L",
      refrigerantId: "R-448A",
      fullCharge: lb(1600),
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
      inServiceOn: "2026-03-01",
    });
    const rec = (await (await signedIn("engineer")).get(`/api/systems/${res.body.id}/records`)).body;
    expect(rec.automaticLeakDetection).toMatchObject({ required: true, dueOn: "2026-03-31" });
    expect(rec.due.find((d: { kind: string }) => d.kind === "automatic-leak-detection")).toMatchObject({
      dueOn: "2026-03-31",
      link: `/systems/${res.body.id}#sys-due`,
    });
  });

  it("puts a retrofit-or-retire plan due when the follow-up verification test fails ([M], docs/decisions/0044)", async () => {
    const id = await newSystem("Rack M");
    const finding = await newFinding(id);
    const lead = await signedIn("lead-tech");
    for (const step of [
      { action: "repair", on: "2026-04-05" },
      { action: "initial-test", on: "2026-04-05", result: "passed" },
      { action: "follow-up-test", on: "2026-04-15", result: "failed" },
    ]) {
      const r = await lead.post(`/api/findings/${finding}/events`, step);
      expect(r.status, JSON.stringify(r.body)).toBe(200);
    }
    const rec = (await lead.get(`/api/systems/${id}/records`)).body;
    // Plan within 30 days of the failed test, carried out within 1 year [M].
    expect(
      rec.due
        .filter((d: { kind: string }) => d.kind.startsWith("retrofit"))
        .map((d: { kind: string; dueOn: string }) => [d.kind, d.dueOn]),
    ).toEqual([
      ["retrofit-or-retire-plan", "2026-05-15"],
      ["retrofit-or-retire", "2027-04-15"],
    ]);
  });
});
