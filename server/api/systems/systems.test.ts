import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, type Agent, type TestApp, signIn } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import type { Role } from "#core/domain/roles";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Juniper Row Foods");
  other = await seedCompany(t.ctx, "Copperleaf Grocers");
});
afterAll(() => t.close());

const signedIn = (role: Role, company = co): Promise<Agent> => signIn(t.app, company.people[role]);

const rack = {
  name: "Rack A (medium temp)",
  refrigerantId: "R-448A",
  fullCharge: { value: 500, unit: "lb" },
  applianceType: "commercial-refrigeration",
  automaticLeakDetection: true,
};

describe("systems", () => {
  it("stores the charge in kg (lb × 0.45359237 exactly) and returns safety class, GWP and cautions", async () => {
    const lead = await signedIn("lead-tech");
    const res = await lead.post(`/api/stores/${co.store.id}/systems`, rack);
    expect(res.status).toBe(201);
    // 500 lb × 0.45359237 kg/lb = 226.796185 kg (NIST SP 811, appendix B.8).
    expect(res.body.fullChargeKg).toBeCloseTo(226.796185, 9);
    expect(res.body.refrigerant).toMatchObject({ id: "R-448A", safetyClass: "A1" });
    // US federal profile: AR4 for the HFCs, AR5 (<1, taken as 1) for the two HFOs AR4 lacks:
    // 0.26×675 + 0.26×3500 + 0.21×1430 + 0.20×1 + 0.07×1 = 1386.07 → 1386 (hand calculation from
    // the catalogue's IPCC values [S:G1]; docs/reference/standards.md §3 notes 1386 when HFOs are near zero).
    expect(res.body.refrigerant.gwp).toMatchObject({ value: 1386, basis: "AR4 + AR5" });
    // The basis is the US profile's stated choice, shown beside the figure (docs/decisions/0045-gwp-basis.md).
    expect(res.body.refrigerant.gwp.statement).toMatch(/^IPCC AR4 100-year values .*AR5's "<1" counts as 1$/);
    expect(res.body.cautions.map((c: { id: string }) => c.id)).toContain("oxygen-displacement");
    expect(res.body.cautions.at(-1).id).toBe("codes-govern");

    const listed = await (await signedIn("technician")).get(`/api/stores/${co.store.id}/systems`);
    expect(listed.status).toBe(200);
    expect(listed.body.systems.map((s: { id: string }) => s.id)).toContain(res.body.id);
  });

  it("shows GWP on the company's rule profile: EU F-gas gives R-448A's published 1387", async () => {
    const owner = await signedIn("owner");
    const s = (await owner.post(`/api/stores/${co.store.id}/systems`, { ...rack, name: "Rack B" })).body;
    await owner.put("/api/company/settings", {
      name: "Juniper Row Foods",
      lengthUnit: "m",
      massUnit: "kg",
      ruleProfile: "eu-fgas",
      leakRateMethod: "annualizing",
      detectorCheckIntervalDays: 30,
    });
    // docs/reference/standards.md §3 blend table: R-448A 1387 on AR4 with the 517/2014 HFO values.
    expect((await owner.get(`/api/systems/${s.id}`)).body.refrigerant.gwp).toMatchObject({
      value: 1387,
      basis: "AR4 + EU-517/2014",
    });
    await owner.put("/api/company/settings", {
      name: "Juniper Row Foods",
      lengthUnit: "m",
      massUnit: "kg",
      ruleProfile: "us-federal",
      leakRateMethod: "annualizing",
      detectorCheckIntervalDays: 30,
    });
  });

  it("accepts R-744 with its high-pressure caution and a flammable A2L with the flammability caution", async () => {
    const owner = await signedIn("owner");
    const co2 = await owner.post(`/api/stores/${co.store.id}/systems`, {
      ...rack,
      name: "LT rack",
      refrigerantId: "r744",
      fullCharge: { value: 180, unit: "kg" },
    });
    expect(co2.status).toBe(201);
    expect(co2.body).toMatchObject({ refrigerantId: "R-744", fullChargeKg: 180 });
    expect(co2.body.refrigerant.gwp.value).toBe(1); // CO2 is the GWP reference gas (IPCC)
    expect(co2.body.cautions.map((c: { id: string }) => c.id)).toContain("high-pressure-co2");
    const a2l = await owner.post(`/api/stores/${co.store.id}/systems`, {
      ...rack,
      name: "Office split",
      refrigerantId: "R-454B",
      fullCharge: { value: 4.2, unit: "kg" },
      applianceType: "comfort-cooling",
    });
    expect(a2l.body.refrigerant.safetyClass).toBe("A2L");
    expect(a2l.body.cautions[0].id).toBe("flammable");
  });

  it("refuses an unknown refrigerant, a charge of 0 and unknown appliance types with field errors", async () => {
    const lead = await signedIn("lead-tech");
    const unknown = await lead.post(`/api/stores/${co.store.id}/systems`, { ...rack, refrigerantId: "R-9999" });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields.refrigerantId).toMatch(
      /is not in the catalogue .* nor among the company.s own refrigerants/,
    );
    const bad = await lead.post(`/api/stores/${co.store.id}/systems`, {
      ...rack,
      name: "",
      fullCharge: { value: 0, unit: "stone" },
      applianceType: "freezer",
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toMatchObject({
      name: "is required",
      "fullCharge.value": "must be more than 0",
      "fullCharge.unit": "must be kg or lb",
      applianceType: expect.stringMatching(/commercial-refrigeration/),
    });
    const negative = await lead.post(`/api/stores/${co.store.id}/systems`, {
      ...rack,
      fullCharge: { value: -3, unit: "kg" },
    });
    expect(negative.body.error.fields["fullCharge.value"]).toBe("must be more than 0");
  });

  it("edits and deletes with stores.edit; technicians and engineers only read", async () => {
    const lead = await signedIn("lead-tech");
    const s = (
      await lead.post(`/api/stores/${co.store.id}/systems`, { ...rack, name: "Walk-in unit", refrigerantId: "R-404A" })
    ).body;
    const edited = await lead.patch(`/api/systems/${s.id}`, {
      fullCharge: { value: 30, unit: "kg" },
      automaticLeakDetection: false,
    });
    expect(edited.body).toMatchObject({ fullChargeKg: 30, automaticLeakDetection: false, refrigerantId: "R-404A" });
    for (const role of ["technician", "engineer", "store-contact"] as Role[]) {
      const a = await signedIn(role);
      expect((await a.post(`/api/stores/${co.store.id}/systems`, rack)).status).toBe(403);
      expect((await a.patch(`/api/systems/${s.id}`, { name: "x" })).status).toBe(403);
      expect((await a.delete(`/api/systems/${s.id}`)).status).toBe(403);
    }
    expect((await (await signedIn("engineer")).get(`/api/systems/${s.id}`)).status).toBe(200);
    expect((await lead.delete(`/api/systems/${s.id}`)).body).toEqual({ outcome: "deleted", system: null });
    expect((await lead.get(`/api/systems/${s.id}`)).status).toBe(404);
  });

  it("store contacts read systems of their store only; other companies get 404", async () => {
    const owner = await signedIn("owner");
    const mine = (await owner.post(`/api/stores/${co.otherStore.id}/systems`, rack)).body;
    const contact = await signedIn("store-contact");
    expect((await contact.get(`/api/stores/${co.store.id}/systems`)).status).toBe(200);
    expect((await contact.get(`/api/stores/${co.otherStore.id}/systems`)).status).toBe(404);
    expect((await contact.get(`/api/systems/${mine.id}`)).status).toBe(404);
    const stranger = await signedIn("owner", other);
    expect((await stranger.get(`/api/systems/${mine.id}`)).status).toBe(404);
    expect((await stranger.patch(`/api/systems/${mine.id}`, { name: "x" })).status).toBe(404);
    expect((await stranger.post(`/api/stores/${co.store.id}/systems`, rack)).status).toBe(404);
  });

  it("lists the refrigerant catalogue for the picker", async () => {
    const res = await (await signedIn("technician")).get("/api/refrigerants");
    const ids = res.body.refrigerants.map((r: { id: string }) => r.id);
    expect(ids).toEqual(expect.arrayContaining(["R-404A", "R-448A", "R-744", "R-290"]));
  });

  it("gives a CO2 system the exposure limits as published, deferring to the site's detector", async () => {
    const lead = await signedIn("lead-tech");
    const res = await lead.post(`/api/stores/${co.store.id}/systems`, {
      ...rack,
      name: "CO2 booster",
      refrigerantId: "R-744",
    });
    // ACGIH 5,000 ppm TWA, 30,000 ppm STEL [S:S2]; OSHA PEL 5,000 ppm TWA, from memory (docs/reference/standards.md §5).
    const co2 = res.body.cautions.find((c: { id: string }) => c.id === "co2-exposure");
    expect(co2.text).toMatch(/5,000 ppm averaged over a work shift and 30,000 ppm over 15 minutes \(ACGIH\)/);
    expect(co2.text).toMatch(/Trust the site's CO2 detector/);
    expect(res.body.cautions.at(-1).id).toBe("codes-govern");
  });
});
