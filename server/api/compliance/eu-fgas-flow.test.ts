import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, type Agent, type TestApp, signInOnce } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { readableSource } from "#core/domain/compliance/citations";
import type { Role } from "#core/domain/roles";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
const signInOnceAs = signInOnce(() => t.app);

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Kestrelgate Frischmarkt");
  const owner = await signInOnceAs(co.people.owner);
  const r = await owner.put("/api/company/settings", {
    name: "Kestrelgate Frischmarkt",
    lengthUnit: "m",
    massUnit: "kg",
    ruleProfile: "eu-fgas",
    leakRateMethod: "annualizing",
    detectorCheckIntervalDays: 30,
  });
  expect(r.status).toBe(200);
});
afterAll(() => t.close());

const signedIn = (role: Role): Promise<Agent> => signInOnceAs(co.people[role]);

describe("an engineer under EU F-gas: leak checks, repair and the re-check (Regulation (EU) 2024/573)", () => {
  it("dates leak checks by CO2-equivalent and the re-check within a month of the repair, in EU words only", async () => {
    const lead = await signedIn("lead-tech");
    const sys = await lead.post(`/api/stores/${co.store.id}/systems`, {
      name: "Kühlstelle 1",
      refrigerantId: "R-404A",
      fullCharge: { value: 20, unit: "kg" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
      inServiceOn: "2026-01-10",
    });
    const id = sys.body.id as string;
    const engineer = await signedIn("engineer");
    let rec = (await engineer.get(`/api/systems/${id}/records`)).body;
    // 20 kg × 3922 / 1000 = 78.44 t CO2e (Art. 3 [S:E7]; R-404A AR4 3922 [S:E1]): the 50–500 t band, every
    // 6 months without a leak detection system (docs/reference/standards.md §2 [S:E1]), from the in-service day.
    expect(rec.co2e.tonnes).toBeCloseTo(78.44, 9);
    expect(rec.leakCheck).toMatchObject({ appliedMonths: 6, withLdsMonths: 12 });
    expect(rec.nextInspection.dueOn).toBe("2026-07-10");
    expect(rec.profile).toMatchObject({ wording: "eu", leakRateRules: false, retentionYears: 5 });

    const tech = await signedIn("technician");
    expect(
      (await tech.post(`/api/systems/${id}/leak-checks`, { checkedOn: "2026-06-01", leakFound: true })).status,
    ).toBe(201);
    const finding = await tech.post(`/api/stores/${co.store.id}/findings`, {
      systemId: id,
      status: "confirmed",
      component: "brazed-joint",
      foundAt: "2026-06-01T10:00:00+02:00",
    });
    await tech.post(`/api/systems/${id}/charge-additions`, {
      addedOn: "2026-06-03",
      amount: { value: 2, unit: "kg" },
      reason: "Recharge after the repair",
      findingId: finding.body.id,
    });
    expect(
      (await lead.post(`/api/findings/${finding.body.id}/events`, { action: "repair", on: "2026-06-03" })).status,
    ).toBe(200);
    // No US verification tests under EU rules, and the finding does not close before the re-check [S:E6].
    const events = `/api/findings/${finding.body.id}/events`;
    const early = await engineer.post(events, { action: "close", on: "2026-06-04" });
    expect(early.status).toBe(409);
    expect(early.body.error.message).toMatch(/leak check after the repair first/);
    const test = await lead.post(events, { action: "initial-test", on: "2026-06-04", result: "passed" });
    expect(test.status).toBe(409);
    expect(test.body.error.message).toMatch(/verified by a leak check after it, not by verification tests/);
    expect((await engineer.get(`/api/findings/${finding.body.id}`)).body.nextActions).toEqual([]);
    rec = (await engineer.get(`/api/systems/${id}/records`)).body;
    // Re-check within 1 month of the repair [S:E6]: 3 Jun → 3 Jul; no US verification tests, no leak rate.
    expect(rec.due.map((d: { kind: string; dueOn: string }) => [d.kind, d.dueOn])).toEqual([
      ["recheck-after-repair", "2026-07-03"],
      ["inspection", "2026-12-01"],
    ]);
    expect(rec.leakRates).toEqual([]);
    expect(rec.chronic).toEqual([]);
    for (const d of rec.due) expect(readableSource(d.source)).not.toMatch(/CFR|EPA/);

    // The re-check: a leak check with no leak found after the repair closes it; the 6 months run from it.
    await tech.post(`/api/systems/${id}/leak-checks`, { checkedOn: "2026-06-20", leakFound: false });
    rec = (await engineer.get(`/api/systems/${id}/records`)).body;
    expect(rec.due.map((d: { kind: string; dueOn: string }) => [d.kind, d.dueOn])).toEqual([
      ["inspection", "2026-12-20"],
    ]);
    // ...and lets the engineer close the finding: the repair held.
    expect((await engineer.get(`/api/findings/${finding.body.id}`)).body.nextActions).toEqual(["close"]);
    const closed = await engineer.post(events, { action: "close", on: "2026-06-20" });
    expect(closed.status).toBe(200);
    expect(closed.body.status).toBe("closed");
  });
});
