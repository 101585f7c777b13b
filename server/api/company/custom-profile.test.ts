import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, type Agent, type TestApp, signInOnce } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import type { Role } from "#core/domain/roles";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;
const signInOnceAs = signInOnce(() => t.app);

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Bramblegate Foods");
  other = await seedCompany(t.ctx, "Saltmarsh Grocers");
});
afterAll(() => t.close());

const signedIn = (role: Role, company = co): Promise<Agent> => signInOnceAs(company.people[role]);

const settings = (ruleProfile: string) => ({
  name: "Bramblegate Foods",
  lengthUnit: "m",
  massUnit: "kg",
  ruleProfile,
  leakRateMethod: "annualizing",
  detectorCheckIntervalDays: 30,
});

async function newSystem(body: object) {
  const res = await (await signedIn("lead-tech")).post(`/api/stores/${co.store.id}/systems`, {
    applianceType: "commercial-refrigeration",
    automaticLeakDetection: false,
    ...body,
  });
  expect(res.status).toBe(201);
  return res.body.id as string;
}

describe("the custom rule profile", () => {
  it("is read by every member, started and edited only by owners", async () => {
    const engineer = await signedIn("engineer");
    const none = await engineer.get("/api/company/custom-profile");
    expect(none.status).toBe(200);
    expect(none.body).toMatchObject({ profile: null, inForce: false });
    expect((await engineer.post("/api/company/custom-profile/start", { from: "us-federal" })).status).toBe(403);
    expect(
      (await (await signedIn("technician")).post("/api/company/custom-profile/start", { from: "us-federal" })).status,
    ).toBe(403);

    const owner = await signedIn("owner");
    expect((await owner.post("/api/company/custom-profile/start", { from: "nowhere" })).body.error.fields).toEqual({
      from: "must be us-federal or eu-fgas",
    });
    const started = await owner.post("/api/company/custom-profile/start", { from: "us-federal" });
    expect(started.status).toBe(201);
    // An unedited copy: 40 CFR 82.157(c) / 84.106 thresholds, 20 % for commercial refrigeration [S:R1, S:R4].
    expect(started.body.profile).toMatchObject({ id: "custom", kind: "custom", basedOn: "us-federal" });
    expect(started.body.profile.leakRateParts[1].thresholds["commercial-refrigeration"].value).toBe(20);
    expect(started.body.savedBy).toBe("owner of Bramblegate Foods");
    expect((await engineer.put("/api/company/custom-profile", started.body.profile)).status).toBe(403);
    // Another company's members never see it.
    expect((await (await signedIn("owner", other)).get("/api/company/custom-profile")).body.profile).toBeNull();
  });

  it("refuses bad values with the field and the reason", async () => {
    const owner = await signedIn("owner");
    const base = (await owner.get("/api/company/custom-profile")).body.profile;
    const edit = (f: (p: typeof base) => void) => {
      const p = structuredClone(base);
      f(p);
      return owner.put("/api/company/custom-profile", p);
    };
    const negative = await edit((p) => (p.leakRateParts[0].thresholds["comfort-cooling"].value = -5));
    expect(negative.status).toBe(400);
    expect(negative.body.error.fields).toEqual({
      "leakRateParts.0.thresholds.comfort-cooling.value": "must be above 0 (% per year)",
    });
    const unsourced = await edit((p) => (p.leakRateParts[1].repairDays.source = "  "));
    expect(unsourced.body.error.fields).toEqual({
      "leakRateParts.1.repairDays.source": "is required (a citation, or who set the value and why)",
    });
    const fractional = await edit((p) => (p.leakRateParts[1].repairDays.value = 14.5));
    expect(fractional.body.error.fields).toEqual({
      "leakRateParts.1.repairDays.value": "must be a whole number of days",
    });
    // The domain check runs after zod: a chronic-leaker report date that is no calendar day.
    const feb30 = await edit((p) => (p.leakRateParts[1].chronicLeaker.reportBy.value = { month: 2, day: 30 }));
    expect(feb30.status).toBe(400);
    expect(feb30.body.error.fields).toEqual({
      "leakRateParts.1.chronicLeaker.reportBy.value.day":
        "must be a day from 1 to 28 in month 2 (one that every year has), got 30",
    });
  });

  it("is used for thresholds and the repair deadline once the company chooses it", async () => {
    const owner = await signedIn("owner");
    const p = (await owner.get("/api/company/custom-profile")).body.profile;
    const part = p.leakRateParts[1];
    part.thresholds["commercial-refrigeration"] = {
      value: 15,
      source: "company policy: 15 % for retail food since the 2026 audit",
    };
    part.repairDays = { value: 14, source: "company policy: repair within 14 days" };
    const saved = await owner.put("/api/company/custom-profile", p);
    expect(saved.status).toBe(200);
    expect(saved.body.profile.leakRateParts[1].repairDays.value).toBe(14);

    const systemId = await newSystem({
      name: "Rack C",
      refrigerantId: "R-448A",
      fullCharge: { value: 100, unit: "lb" },
    });
    const tech = await signedIn("technician");
    for (const [addedOn, value] of [
      ["2026-02-01", 10],
      ["2026-03-03", 1.5],
    ] as const) {
      expect(
        (
          await tech.post(`/api/systems/${systemId}/charge-additions`, {
            addedOn,
            amount: { value, unit: "lb" },
            reason: "Low receiver level",
          })
        ).status,
      ).toBe(201);
    }
    const engineer = await signedIn("engineer");
    // 40 CFR 84.102 annualizing: 1.5/100 ÷ (30/365) × 100 = 18.25 %, below the federal 20 % [S:R4].
    const federal = (await engineer.get(`/api/systems/${systemId}/records`)).body;
    expect(federal.latest.percent).toBeCloseTo(18.25, 2);
    expect(federal.latest.exceeds).toBe(false);

    expect((await owner.put("/api/company/settings", settings("custom"))).status).toBe(200);
    const custom = (await engineer.get(`/api/systems/${systemId}/records`)).body;
    expect(custom.profile.id).toBe("custom");
    expect(custom.applicability).toMatchObject({
      thresholdPercent: 15,
      thresholdSource: "company policy: 15 % for retail food since the 2026 audit",
    });
    expect(custom.latest.exceeds).toBe(true);
    // 3 Mar 2026 + 14 days = 17 Mar 2026 (the company's own deadline).
    expect(custom.latest.repairDue).toBe("2026-03-17");
    const repair = custom.due.find((d: { kind: string }) => d.kind === "repair");
    expect(repair).toMatchObject({
      dueOn: "2026-03-17",
      source: expect.stringContaining("company policy: repair within 14 days"),
    });
    const today = (await engineer.get("/api/today")).body;
    expect(
      today.overThreshold.map((s: { systemId: string; thresholdPercent: number }) => [s.systemId, s.thresholdPercent]),
    ).toEqual([[systemId, 15]]);
    expect((await engineer.get("/api/company/custom-profile")).body.inForce).toBe(true);
  });

  it("starts from EU F-gas and uses its edited CO2e bands for leak checks", async () => {
    const owner = await signedIn("owner");
    const p = (await owner.post("/api/company/custom-profile/start", { from: "eu-fgas" })).body.profile;
    expect(p.basedOn).toBe("eu-fgas");
    const systemId = await newSystem({
      name: "Freezer line",
      refrigerantId: "R-404A",
      fullCharge: { value: 10, unit: "kg" },
    });
    const engineer = await signedIn("engineer");
    // 10 kg × 3922 / 1000 = 39.22 t CO2e [S:E7]; 5–50 t: every 12 months without an LDS [S:E1].
    const before = (await engineer.get(`/api/systems/${systemId}/records`)).body;
    expect(before.co2e.tonnes).toBeCloseTo(39.22, 2);
    expect(before.leakCheck.appliedMonths).toBe(12);

    // Bands that overlap are refused at the band that breaks the order.
    const bad = structuredClone(p);
    bad.leakChecks.co2eBands.value[1].from = 40;
    const refused = await owner.put("/api/company/custom-profile", bad);
    expect(refused.body.error.fields).toEqual({
      "leakChecks.co2eBands.value.1.from":
        "must equal the band below's upper edge (50), so bands ascend without gaps or overlaps",
    });

    // Company policy: a stricter 6-month band from 30 t.
    p.leakChecks.co2eBands = {
      value: [
        { from: 5, to: 30, monthsWithoutLds: 12, monthsWithLds: 24, ldsRequired: false },
        { from: 30, to: 500, monthsWithoutLds: 6, monthsWithLds: 12, ldsRequired: false },
        { from: 500, to: null, monthsWithoutLds: 3, monthsWithLds: 6, ldsRequired: true },
      ],
      source: "company policy: 6-monthly checks from 30 t CO2e",
    };
    expect((await owner.put("/api/company/custom-profile", p)).status).toBe(200);
    const after = (await engineer.get(`/api/systems/${systemId}/records`)).body;
    expect(after.leakCheck.appliedMonths).toBe(6);
    expect(after.nextInspection.source).toBe("company policy: 6-monthly checks from 30 t CO2e");
  });
});
