import Papa from "papaparse";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { companies, complianceAudit } from "../../db/schema/index";
import { createTestApp, type Agent, type TestApp, signIn } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { pdfText } from "../../../tests/helpers/pdf-text";
import type { Role } from "#core/domain/roles";
import { archiveTables } from "../exports/archive-tables";
import { US_FEDERAL_PROFILE } from "#core/domain/compliance/us-federal-profile";
import { binaryBody } from "../../../tests/helpers/binary-body";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Birchmoor Provisions");
  other = await seedCompany(t.ctx, "Saltmarsh Grocers");
});
afterAll(() => t.close());

const signedIn = (role: Role, company = co): Promise<Agent> => signIn(t.app, company.people[role]);

/** R-404A's composition, 125/143a/134a 44/52/4 (ASHRAE 34 [S:G3], docs/reference/standards.md §3). */
const like404A = {
  name: "Freezer blend 44",
  safetyClass: "A1",
  composition: [
    { refrigerantId: "R-125", massPercent: 44 },
    { refrigerantId: "R-143a", massPercent: 52 },
    { refrigerantId: "R-134a", massPercent: 4 },
  ],
};

const stated2500 = {
  name: "Imported HFC mix",
  safetyClass: "A1",
  substanceClass: "hfc",
  statedGwp: { value: 2500, basis: "AR4", source: "maker's safety data sheet, section 12" },
};

const system = (refrigerantId: string, name: string) => ({
  name,
  refrigerantId,
  fullCharge: { value: 20, unit: "kg" },
  applianceType: "commercial-refrigeration",
  automaticLeakDetection: false,
});

async function useProfile(owner: Agent, ruleProfile: "eu-fgas" | "us-federal") {
  const res = await owner.put("/api/company/settings", {
    name: "Birchmoor Provisions",
    lengthUnit: "m",
    massUnit: "kg",
    ruleProfile,
    leakRateMethod: "annualizing",
    detectorCheckIntervalDays: 30,
  });
  expect(res.status).toBe(200);
}

describe("a company's own refrigerants (docs/decisions/0073)", () => {
  it("are entered by owners and lead techs, and a composition equal to R-404A's gives R-404A's GWP", async () => {
    const lead = await signedIn("lead-tech");
    const res = await lead.post("/api/company-refrigerants", like404A);
    expect(res.status).toBe(201);
    // R-404A AR4 3922 [S:E1]; the US profile reads AR4 for these three HFCs.
    expect(res.body.summary).toMatchObject({
      designation: "Freezer blend 44",
      enteredByCompany: true,
      gwp: { value: 3922, basis: "AR4" },
    });
    expect(res.body.substanceClass).toBe("hfc");
    expect(res.body.summary.id).toBe(`company:${res.body.rowId}`);
    for (const role of ["engineer", "technician", "store-contact"] as const) {
      const refused = await (await signedIn(role)).post("/api/company-refrigerants", { ...like404A, name: "X" });
      expect(refused.status, role).toBe(403);
    }
    const audit = await t.ctx.db
      .select()
      .from(complianceAudit)
      .where(and(eq(complianceAudit.companyId, co.company.id), eq(complianceAudit.action, "refrigerant-entered")));
    expect(audit.map((a) => a.summary)).toContainEqual(expect.stringContaining("Freezer blend 44"));
  });

  it("writes the audit's figures in the company's number format", async () => {
    const comma = await seedCompany(t.ctx, "Fenwick Larder");
    await t.ctx.db.update(companies).set({ numberFormat: "1.234,5" }).where(eq(companies.id, comma.company.id));
    const owner = await signedIn("owner", comma);
    // The figures only need decimals and thousands here (R-422D's composition, from memory).
    const mix = await owner.post("/api/company-refrigerants", {
      name: "Retrofit mix 65",
      safetyClass: "A1",
      composition: [
        { refrigerantId: "R-125", massPercent: 65.1 },
        { refrigerantId: "R-134a", massPercent: 31.5 },
        { refrigerantId: "R-600a", massPercent: 3.4 },
      ],
    });
    expect(mix.status, JSON.stringify(mix.body)).toBe(201);
    expect((await owner.post("/api/company-refrigerants", stated2500)).status).toBe(201);
    const audit = await t.ctx.db
      .select()
      .from(complianceAudit)
      .where(and(eq(complianceAudit.companyId, comma.company.id), eq(complianceAudit.action, "refrigerant-entered")));
    expect(audit.map((a) => a.summary).sort()).toEqual([
      "Refrigerant entered by the company: Imported HFC mix, A1, GWP 2.500 (AR4; maker's safety data sheet, section 12)",
      "Refrigerant entered by the company: Retrofit mix 65, A1, R-125 65,1 %, R-134a 31,5 %, R-600a 3,4 %",
    ]);
  });

  it("refuses bad entries with the field and the reason, and saves nothing", async () => {
    const owner = await signedIn("owner");
    const cases: [object, string, RegExp][] = [
      [
        {
          ...like404A,
          name: "Short one",
          composition: [
            { refrigerantId: "R-125", massPercent: 44 },
            { refrigerantId: "R-143a", massPercent: 52 },
          ],
        },
        "composition",
        /add up to 96 %/,
      ],
      [{ ...like404A, name: "r-404a" }, "name", /is the catalogue's R-404A/],
      [{ ...like404A, name: "FREEZER  blend 44" }, "name", /already the name/],
      [{ ...like404A, name: "Both", statedGwp: stated2500.statedGwp }, "statedGwp", /not both/],
      [{ ...stated2500, name: "No class", substanceClass: undefined }, "substanceClass", /is required/],
      [
        { ...stated2500, name: "Huge", statedGwp: { ...stated2500.statedGwp, value: 1e9 } },
        "statedGwp.value",
        /at most/,
      ],
      [{ ...like404A, name: "=cmd|calc" }, "name", /letters, digits/],
      [
        {
          ...like404A,
          name: "Blend in",
          composition: [{ refrigerantId: "R-404A", massPercent: 100 }, like404A.composition[0]],
        },
        "composition.0.refrigerantId",
        /is a blend/,
      ],
    ];
    for (const [body, field, reason] of cases) {
      const res = await owner.post("/api/company-refrigerants", body);
      expect(res.status, field).toBe(400);
      expect(res.body.error.fields[field], field).toMatch(reason);
    }
    const list = (await owner.get("/api/company-refrigerants")).body.refrigerants;
    expect(list.map((r: { summary: { designation: string } }) => r.summary.designation)).toEqual(["Freezer blend 44"]);
  });

  it("are never seen nor used by another company", async () => {
    const mine = (await (await signedIn("owner")).get("/api/company-refrigerants")).body.refrigerants[0];
    const stranger = await signedIn("owner", other);
    expect((await stranger.get("/api/company-refrigerants")).body.refrigerants).toEqual([]);
    const picker = (await stranger.get("/api/refrigerants")).body.refrigerants;
    expect(picker.some((r: { id: string }) => r.id === mine.summary.id)).toBe(false);
    const used = await stranger.post(`/api/stores/${other.store.id}/systems`, system(mine.summary.id, "Rack Z"));
    expect(used.status).toBe(400);
    expect(used.body.error.fields.refrigerantId).toMatch(/not in the catalogue .* nor among the company's own/);
    expect((await stranger.patch(`/api/company-refrigerants/${mine.rowId}`, { retired: true })).status).toBe(404);
    expect((await stranger.delete(`/api/company-refrigerants/${mine.rowId}`)).status).toBe(404);
    // And it is still ours, untouched.
    const again = (await (await signedIn("owner")).get("/api/company-refrigerants")).body.refrigerants[0];
    expect(again.retired).toBe(false);
  });

  it("work in every figure: EU CO2e and check interval from a stated GWP, the CSV and the PDF say who entered it", async () => {
    const owner = await signedIn("owner");
    const entered = (await owner.post("/api/company-refrigerants", stated2500)).body;
    expect(entered.summary.gwp.statement).toBe("stated by the company on AR4 (maker's safety data sheet, section 12)");
    const picker = (await owner.get("/api/refrigerants")).body.refrigerants;
    expect(picker.find((r: { id: string }) => r.id === entered.summary.id)?.enteredByCompany).toBe(true);
    const s = await owner.post(`/api/stores/${co.store.id}/systems`, system(entered.summary.id, "Rack E"));
    expect(s.status).toBe(201);
    expect(s.body.refrigerant.designation).toBe("Imported HFC mix");

    await useProfile(owner, "eu-fgas");
    try {
      const rec = (await owner.get(`/api/systems/${s.body.id}/records`)).body;
      // 20 kg × 2,500 / 1000 = 50 t CO2e (2024/573 Art. 3 [S:E7]); ≥50 <500 t: every 6 months
      // without a leak detection system (Art. 5 bands [S:E1,E5], docs/reference/standards.md §2).
      expect(rec.co2e).toMatchObject({ known: true, gwp: 2500 });
      expect(rec.co2e.tonnes).toBeCloseTo(50, 9);
      expect(rec.leakCheck).toMatchObject({ appliedMonths: 6, withLdsMonths: 12 });

      // The CSV lists records: one charge entry gives a row carrying the figures' columns.
      await owner.post(`/api/systems/${s.body.id}/charge-additions`, {
        amount: { value: 1, unit: "kg" },
        reason: "Top-up",
      });
      const csv2 = await owner.agent.get(`/api/systems/${s.body.id}/records.csv`).buffer(true).parse(binaryBody);
      const parsed = Papa.parse<Record<string, string>>((csv2.body as Buffer).toString("utf8"), {
        header: true,
        skipEmptyLines: true,
      });
      expect(parsed.errors).toEqual([]);
      const row = parsed.data[0];
      expect(row).toMatchObject({
        refrigerant: "Imported HFC mix (entered by the company)",
        gwp: "2500",
        gwp_basis: "stated by the company on AR4 (maker's safety data sheet, section 12)",
        co2e_tonnes: "50",
      });

      const pdf = await owner.agent
        .get(`/api/systems/${s.body.id}/leak-rate-statement.pdf`)
        .buffer(true)
        .parse(binaryBody);
      const text = (await pdfText(pdf.body as Buffer)).join(" ").replace(/\s+/g, " ");
      expect(text).toContain("Refrigerant Imported HFC mix (entered by the company)");
      expect(text).toContain("GWP 2,500 on AR4");
      expect(text).toContain("GWP basis: stated by the company on AR4 (maker's safety data sheet, section 12).");
    } finally {
      await useProfile(owner, "us-federal");
    }
    // Under the US profile the same GWP (> 53, not ODS) puts a 20 kg (44 lb) system under Part 84
    // from 15 lb (docs/reference/standards.md §1 [S:R4]).
    const us = (await owner.get(`/api/systems/${s.body.id}/records`)).body;
    expect(us.applicability).toMatchObject({ applies: true, partId: "40-cfr-84-subpart-c" });
  });

  it("in use are retired, never deleted; retired ones leave the picker but keep their systems", async () => {
    const owner = await signedIn("owner");
    const list = (await owner.get("/api/company-refrigerants")).body.refrigerants;
    const used = list.find((r: { summary: { designation: string } }) => r.summary.designation === "Imported HFC mix");
    expect(used.systemsUsing).toBe(1);
    const refused = await owner.delete(`/api/company-refrigerants/${used.rowId}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/retire it instead/);

    const retired = await owner.patch(`/api/company-refrigerants/${used.rowId}`, { retired: true });
    expect(retired.status).toBe(200);
    expect(retired.body.retired).toBe(true);
    const picker = (await owner.get("/api/refrigerants")).body.refrigerants;
    expect(picker.some((r: { id: string }) => r.id === used.summary.id)).toBe(false);
    const systems = (await owner.get(`/api/stores/${co.store.id}/systems`)).body.systems;
    expect(systems.find((x: { name: string }) => x.name === "Rack E").refrigerant.designation).toBe("Imported HFC mix");
    const newUse = await owner.post(`/api/stores/${co.store.id}/systems`, system(used.summary.id, "Rack F"));
    expect(newUse.status).toBe(400);
    expect(newUse.body.error.fields.refrigerantId).toMatch(/was retired/);

    // One no system ever named goes for good, on the audit trail.
    const unused = list.find((r: { summary: { designation: string } }) => r.summary.designation === "Freezer blend 44");
    expect((await owner.delete(`/api/company-refrigerants/${unused.rowId}`)).status).toBe(204);
    const actions = (
      await t.ctx.db.select().from(complianceAudit).where(eq(complianceAudit.companyId, co.company.id))
    ).map((a) => a.action);
    expect(actions).toEqual(expect.arrayContaining(["refrigerant-retired", "refrigerant-deleted"]));

    // The owner's archive lists it beside the systems that name it.
    const tables = await archiveTables(t.ctx, co.company.id, US_FEDERAL_PROFILE);
    const own = tables.find((x) => x.file === "company-refrigerants.csv")!;
    expect(own.rows.map((r) => (r as { name: string }).name)).toEqual(["Imported HFC mix"]);
  });
});
