import Papa from "papaparse";
import { PDFDocument } from "pdf-lib";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, type Agent, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import { pdfText } from "../../../tests/helpers/pdf-text";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { binaryBody } from "../../../tests/helpers/binary-body";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;
let tech: Agent;
let systemId: string;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Hollyhock Foods");
  other = await seedCompany(t.ctx, "Windrow Markets");
  tech = await agentFor(t.app);
  await tech.post("/api/auth/sign-in", { email: co.people.technician.email, password: PASSWORD });
  const lead = await agentFor(t.app);
  await lead.post("/api/auth/sign-in", { email: co.people["lead-tech"].email, password: PASSWORD });
  systemId = (
    await lead.post(`/api/stores/${co.store.id}/systems`, {
      name: "Rack A (MT)",
      refrigerantId: "R-448A",
      fullCharge: { value: 100, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
    })
  ).body.id;
  await tech.post(`/api/systems/${systemId}/charge-additions`, {
    addedOn: "2026-02-01",
    amount: { value: 10, unit: "lb" },
    reason: 'Top-up, "quoted", with comma',
  });
  const second = await tech.post(`/api/systems/${systemId}/charge-additions`, {
    addedOn: "2026-03-03",
    amount: { value: 5, unit: "lb" },
    reason: "Low charge",
  });
  await tech.post(`/api/charge-additions/${second.body.addition.id}/void`, { voidReason: "Duplicate entry" });
  const f = (
    await tech.post(`/api/stores/${co.store.id}/findings`, {
      systemId,
      status: "confirmed",
      component: "flare",
      foundAt: "2026-02-02T15:00:00Z",
    })
  ).body;
  await tech.post(`/api/findings/${f.id}/events`, { action: "repair", on: "2026-02-03", note: "New flare nut" });
});
afterAll(() => t.close());

describe("records export", () => {
  it("writes a CSV of charge added (voided entries kept) and finding steps, with the leak rate at each addition", async () => {
    const res = await tech.get(`/api/systems/${systemId}/records.csv`);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toMatch(/text\/csv/);
    expect(res.headers["content-disposition"]).toContain("rack-a-mt-records.csv");
    const parsed = Papa.parse<Record<string, string>>(res.text, { header: true });
    expect(parsed.errors).toEqual([]);
    // The system's revisions and audit trail have rows of their own (statement-history.test.ts).
    const rows = parsed.data.filter((r) => !/^(system revision|audit trail)/.test(r.record));
    expect(rows.map((r) => [r.date, r.record])).toEqual([
      ["2026-02-01", "charge added"],
      ["2026-02-02", "finding found"],
      ["2026-02-02", "finding confirmed"],
      ["2026-02-03", "finding repaired"],
      ["2026-03-03", "charge added"],
    ]);
    // First calculation after 1 Jan 2026 uses 365 days: 10/100 = 10.00 % (40 CFR 84.102 [M]).
    expect(rows[0]).toMatchObject({
      // Written as numbers (so formula escaping never touches them): no trailing zeros.
      amount_lb: "10",
      amount_kg: "4.5359",
      leak_rate_percent: "10",
      reason: 'Top-up, "quoted", with comma',
    });
    expect(rows[4].voided).toMatch(/Duplicate entry/);
    expect(rows[4].leak_rate_percent).toBe("");
  });

  it("makes a PDF statement with the Atkinson Hyperlegible font embedded, for members only", async () => {
    const res = await tech.agent.get(`/api/systems/${systemId}/leak-rate-statement.pdf`).buffer(true).parse(binaryBody);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toBe("application/pdf");
    const bytes = res.body as Buffer;
    expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
    const pdf = await PDFDocument.load(bytes);
    expect(pdf.getPageCount()).toBeGreaterThanOrEqual(1);
    expect(pdf.getTitle()).toBe("Leak-rate statement – Rack A (MT)");
    // Embedded TrueType subsets are named "ABCDEF+AtkinsonHyperlegible-…" (ISO 32000-1 §9.6.4).
    expect(bytes.toString("latin1")).toMatch(/\/BaseFont \/[A-Z]{6}\+AtkinsonHyperlegible-Regular/);
    // Rules are cited for readers ("40 CFR 84.106"); our internal source tags stay out of the statement.
    const text = (await pdfText(bytes)).join(" ").replace(/\s+/g, " ");
    // A Part 84 system cites Part 84's rule, never Part 82's (docs/reference/standards.md §1 table [S:R4]).
    expect(text).toContain("Threshold 20 % per year (40 CFR 84.106, commercial refrigeration)");
    expect(text).not.toMatch(/82\.157/);
    // The annualizing formula as docs/reference/standards.md §1 gives it: (added / full charge) ÷ (days / 365) × 100.
    expect(text).toContain("leak rate % = (added ÷ full charge) ÷ (days ÷ 365) × 100");
    expect(text).not.toMatch(/\[(S:|M\]|D\])/);
    const stranger = await agentFor(t.app);
    await stranger.post("/api/auth/sign-in", { email: other.people.owner.email, password: PASSWORD });
    expect((await stranger.get(`/api/systems/${systemId}/leak-rate-statement.pdf`)).status).toBe(404);
    expect((await stranger.get(`/api/systems/${systemId}/records.csv`)).status).toBe(404);
  });

  it("writes an EU F-gas statement in the regulation's words, with nothing US in it", async () => {
    const owner = await agentFor(t.app);
    await owner.post("/api/auth/sign-in", { email: co.people.owner.email, password: PASSWORD });
    const settings = (ruleProfile: string) => ({
      name: "Hollyhock Foods",
      lengthUnit: "m",
      massUnit: "kg",
      ruleProfile,
      leakRateMethod: "annualizing",
      detectorCheckIntervalDays: 30,
    });
    expect((await owner.put("/api/company/settings", settings("eu-fgas"))).status).toBe(200);
    try {
      const res = await tech.agent
        .get(`/api/systems/${systemId}/leak-rate-statement.pdf`)
        .buffer(true)
        .parse(binaryBody);
      const text = (await pdfText(res.body as Buffer)).join(" ").replace(/\s+/g, " ");
      expect(text).not.toMatch(/CFR|EPA|Section 608|leak-rate method|No refrigerant has been added/);
      // EU F-gas sets leak checks, not a leak rate: the statement is named for what it holds.
      expect(text).toMatch(/^F-gas record statement /);
      expect(text).not.toMatch(/Leak-rate statement/);
      // The 10 lb addition is a row of the refrigerant-added table (date, amount, technician); kg first for a kg company.
      expect(text).toContain("1 Feb 2026 4.54 kg (10.0 lb) technician of Hollyhock Foods");
      // 45.359237 kg × 1387 / 1000 = 62.913 t CO2e: the 50–500 t band, every 6 months without a leak detection
      // system, 12 with one (Regulation (EU) 2024/573 Art. 5 intervals, docs/reference/standards.md §2 [S:E1]).
      expect(text).toContain("every 6 months, with one every 12 months");
      // GWP basis stated beside the CO2e: R-448A is 1387 on AR4 with the 517/2014 HFO values (docs/reference/standards.md §3 [D]).
      expect(text).toContain("kg × GWP 1,387 / 1000");
      expect(text).toContain("GWP basis: IPCC AR4 100-year values as in Regulation (EU) 2024/573 Annex I");
      const csv = Papa.parse<Record<string, string>>((await tech.get(`/api/systems/${systemId}/records.csv`)).text, {
        header: true,
      }).data;
      expect(csv[0]).toMatchObject({ gwp: "1387", co2e_tonnes: "62.913" });
      expect(csv[0].gwp_basis).toMatch(/Regulation \(EU\) 2024\/573 Annex I/);
      // Records at least 5 years (2024/573 Art. 7 [S:E8b]).
      expect(text).toContain("at least 5 years");
    } finally {
      expect((await owner.put("/api/company/settings", settings("us-federal"))).status).toBe(200);
    }
  });

  it("says in the statement that a system is retired, until when its records are kept, and names each finding's component", async () => {
    const owner = await agentFor(t.app);
    await owner.post("/api/auth/sign-in", { email: co.people.owner.email, password: PASSWORD });
    const id = (
      await owner.post(`/api/stores/${co.store.id}/systems`, {
        name: "Rack R (retired)",
        refrigerantId: "R-448A",
        fullCharge: { value: 620, unit: "lb" },
        applianceType: "commercial-refrigeration",
        automaticLeakDetection: false,
        inServiceOn: "2024-03-01",
      })
    ).body.id;
    await tech.post(`/api/systems/${id}/charge-additions`, {
      addedOn: "2026-02-09",
      amount: { value: 150, unit: "lb" },
      reason: "Recharge",
    });
    await tech.post(`/api/stores/${co.store.id}/findings`, {
      systemId: id,
      status: "confirmed",
      component: "brazed-joint",
      foundAt: "2026-02-09T17:00:00Z",
    });
    const retired = await owner.post(`/api/systems/${id}/retire`, {
      retiredOn: (await tech.get(`/api/systems/${id}/records`)).body.today,
      reasonKind: "other",
      reason: "Replaced by a CO2 booster",
    });
    expect(retired.status).toBe(200);
    const res = await tech.agent.get(`/api/systems/${id}/leak-rate-statement.pdf`).buffer(true).parse(binaryBody);
    const text = (await pdfText(res.body as Buffer)).join(" ").replace(/\s+/g, " ");
    const records = (await tech.get(`/api/systems/${id}/records`)).body;
    // Kept 3 years after the retirement day (docs/reference/standards.md §1 [S:R6,R7]; docs/decisions/0040).
    expect(records.retention.keptUntil).toBe(`${Number(records.today.slice(0, 4)) + 3}${records.today.slice(4)}`);
    expect(text).toContain(`Retired on ${formatCalendarDay(records.today)} (Replaced by a CO2 booster)`);
    expect(text).toContain(`kept at least until ${formatCalendarDay(records.retention.keptUntil)}`);
    // the retention line names its years once and cites the rule (40 CFR 82 subpart F and 84 subpart C [S:R6,R7])
    expect(text).toContain("Keep these records for at least 3 years (40 CFR 82 subpart F and 84 subpart C).");
    expect(text).not.toMatch(/records kept 3 years/);
    // 150 lb into 620 lb over 365 days (84.102, first calculation in 2026 [M]) = 24.2 % > 20 %: a breach, and
    // yet a retired system owes no inspection, so none is named as next (docs/decisions/0040).
    expect(text).toContain("24.2 %");
    expect(text).not.toContain("Next inspection");
    // The component in words, as on the screens; the GWP grouped in the company's format.
    expect(text).toContain("Brazed joint – confirmed");
    expect(text).toContain("GWP 1,386 on AR4 + AR5");
    expect(text).toContain("today is");
  });

  it("cites for each figure the part in force on its date: after a retrofit, the R-22 figure keeps 82.157", async () => {
    const lead = await agentFor(t.app);
    await lead.post("/api/auth/sign-in", { email: co.people.owner.email, password: PASSWORD });
    const id = (
      await lead.post(`/api/stores/${co.store.id}/systems`, {
        name: "Rack D (retrofitted)",
        refrigerantId: "R-22",
        fullCharge: { value: 180, unit: "lb" },
        applianceType: "commercial-refrigeration",
        automaticLeakDetection: false,
        inServiceOn: "2019-05-01",
      })
    ).body.id;
    // R-22 is ozone-depleting, 180 lb ≥ 50 lb: 40 CFR 82 subpart F, 20 % for commercial refrigeration [S:R1].
    // 45/180 over the first calculation's 365 days [M] = 25 %.
    await tech.post(`/api/systems/${id}/charge-additions`, {
      addedOn: "2026-04-02",
      amount: { value: 45, unit: "lb" },
      reason: "Recharge",
    });
    const revised = await lead.post(`/api/systems/${id}/revisions`, {
      effectiveFrom: "2026-05-12",
      kind: "retrofit",
      reason: "Converted to R-448A",
      refrigerantId: "R-448A",
    });
    expect(revised.status).toBe(201);
    // The retrofit fill counts no loss (82.157 [S:R1]); 40 lb 81 days later: 40/180 ÷ (81/365) × 100 = 100.137 %,
    // now under 40 CFR 84 subpart C (R-448A, GWP > 53 [S:R4]).
    await tech.post(`/api/systems/${id}/charge-additions`, {
      addedOn: "2026-05-12",
      amount: { value: 165, unit: "lb" },
      reason: "Retrofit fill",
      excluded: "retrofit",
    });
    await tech.post(`/api/systems/${id}/charge-additions`, {
      addedOn: "2026-08-01",
      amount: { value: 40, unit: "lb" },
      reason: "Top-up",
    });
    const rows = Papa.parse<Record<string, string>>((await tech.get(`/api/systems/${id}/records.csv`)).text, {
      header: true,
    }).data.filter((r) => r.record === "charge added");
    expect(rows.map((r) => [r.date, r.leak_rate_percent, r.threshold_rule])).toEqual([
      ["2026-04-02", "25", "40 CFR 82.157(c), commercial refrigeration"],
      ["2026-05-12", "", ""],
      ["2026-08-01", "100.14", "40 CFR 84.106, commercial refrigeration"],
    ]);
    const res = await tech.agent.get(`/api/systems/${id}/leak-rate-statement.pdf`).buffer(true).parse(binaryBody);
    const text = (await pdfText(res.body as Buffer)).join(" ").replace(/\s+/g, " ");
    expect(text).toMatch(/25\.0 % \(above\) 20 % \(40 CFR 82\.157\(c\), commercial refrigeration\)/);
    expect(text).toMatch(/100\.1 % \(above\) 20 % \(40 CFR 84\.106, commercial refrigeration\)/);
  });
});
