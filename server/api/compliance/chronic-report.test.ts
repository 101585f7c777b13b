import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, type Agent, type TestApp, signInOnce } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import type { Role } from "#core/domain/roles";
import { pdfText } from "../../../tests/helpers/pdf-text";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { binaryBody } from "../../../tests/helpers/binary-body";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
const signInOnceAs = signInOnce(() => t.app);

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Wrenfield Markets");
});
afterAll(() => t.close());

const signedIn = (role: Role): Promise<Agent> => signInOnceAs(co.people[role]);

describe("filing the chronic-leaker report", () => {
  let systemId: string;
  let year: number;

  beforeAll(async () => {
    const lead = await signedIn("lead-tech");
    const sys = await lead.post(`/api/stores/${co.store.id}/systems`, {
      // R-22 (an HCFC): 40 CFR 82 subpart F applies in every year from 50 lb [S:R1], so last year counts.
      name: "Deli case line",
      refrigerantId: "R-22",
      fullCharge: { value: 60, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
    });
    expect(sys.status).toBe(201);
    systemId = sys.body.id;
    // Last calendar year on the store's calendar, so the report is the one that can still be acted on.
    const today = (await lead.get(`/api/systems/${systemId}/records`)).body.today as string;
    year = Number(today.slice(0, 4)) - 1;
    const tech = await signedIn("technician");
    for (const [addedOn, value] of [
      [`${year}-03-02`, 45],
      [`${year}-09-01`, 36],
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
  });

  it("is due by 1 March of the next year once 125 % of the full charge was added in the year", async () => {
    const r = (await (await signedIn("engineer")).get(`/api/systems/${systemId}/records`)).body;
    // [S:R7]: 45 + 36 = 81 lb into a 60 lb charge = 135 % ≥ 125 % → report by 1 March of the next year.
    const y = r.chronic.find((c: { year: number }) => c.year === year);
    expect(y).toMatchObject({ chronic: true, reportDue: `${year + 1}-03-01`, filed: null });
    expect(y.percent).toBeCloseTo(135, 6);
    expect(
      r.due.filter((d: { kind: string }) => d.kind === "chronic-leaker-report").map((d: { dueOn: string }) => d.dueOn),
    ).toEqual([`${year + 1}-03-01`]);
  });

  it("is filed by engineers and owners only, for a chronic year that is over, once", async () => {
    const body = { year, filedOn: `${year + 1}-01-01`, reference: "EPA-CL-0042" };
    for (const role of ["technician", "lead-tech", "store-contact"] as const) {
      expect((await (await signedIn(role)).post(`/api/systems/${systemId}/chronic-reports`, body)).status).toBe(403);
    }
    const engineer = await signedIn("engineer");
    const notChronic = await engineer.post(`/api/systems/${systemId}/chronic-reports`, { ...body, year: year - 1 });
    expect(notChronic.status).toBe(400);
    expect(Object.keys(notChronic.body.error.fields)).toEqual(["year"]);
    const early = await engineer.post(`/api/systems/${systemId}/chronic-reports`, {
      ...body,
      filedOn: `${year}-12-31`,
    });
    expect(early.body.error.fields).toEqual({
      filedOn: `must be in ${year + 1} or later: the report covers the whole of ${year}`,
    });
    const future = await engineer.post(`/api/systems/${systemId}/chronic-reports`, {
      ...body,
      filedOn: `${year + 3}-01-01`,
    });
    expect(Object.keys(future.body.error.fields)).toEqual(["filedOn"]);
    expect(
      (await engineer.post(`/api/systems/${systemId}/chronic-reports`, { ...body, year: 1999 })).body.error.fields,
    ).toEqual({ year: "must be 2000 or later" });

    const filed = await engineer.post(`/api/systems/${systemId}/chronic-reports`, body);
    expect(filed.status).toBe(201);
    const y = filed.body.chronic.find((c: { year: number }) => c.year === year);
    expect(y.filed).toMatchObject({
      on: `${year + 1}-01-01`,
      by: "engineer of Wrenfield Markets",
      reference: "EPA-CL-0042",
    });
    // The due item closes, on the records and on Today.
    expect(filed.body.due.some((d: { kind: string }) => d.kind === "chronic-leaker-report")).toBe(false);
    const today = (await engineer.get("/api/today")).body;
    expect(
      today.due.some(
        (d: { kind: string; systemId: string }) => d.kind === "chronic-leaker-report" && d.systemId === systemId,
      ),
    ).toBe(false);
    // The audit trail names who did it and when.
    expect(filed.body.audit).toHaveLength(1);
    expect(filed.body.audit[0]).toMatchObject({
      action: "chronic-report-filed",
      by: "engineer of Wrenfield Markets",
      summary: `Chronic-leaker report for ${year} marked filed on ${year + 1}-01-01 (reference EPA-CL-0042)`,
    });

    // The leak-rate statement carries the filing.
    const pdf = await engineer.agent
      .get(`/api/systems/${systemId}/leak-rate-statement.pdf`)
      .buffer(true)
      .parse(binaryBody);
    // The "Chronic leaker" cell of the year; cells wrap ("EPA- CL-0042"), so words are compared without spacing.
    const text = (await pdfText(pdf.body as Buffer)).join("").replace(/\s+/g, "");
    const filing = `yes; report filed on ${formatCalendarDay(`${year + 1}-01-01`)} by engineer of Wrenfield Markets (reference EPA-CL-0042)`;
    expect(text).toContain(filing.replace(/\s+/g, ""));

    const csv = await engineer.get(`/api/systems/${systemId}/records.csv`);
    expect(csv.text).toContain(`chronic-leaker report for ${year} filed,${year + 1}-01-01`);

    const again = await (await signedIn("owner")).post(`/api/systems/${systemId}/chronic-reports`, body);
    expect(again.status).toBe(409);
  });

  it("counts no year in which no part applied: an HFC system has no 2025 report (Part 84 from 1 Jan 2026)", async () => {
    // docs/reference/standards.md §1: Part 84 applies from 1 Jan 2026 [S:R4]; Part 82 leak repair covers
    // ozone-depleting refrigerants only since 10 Apr 2020 [S:R1,R2]. 125 % rule [S:R7].
    const lead = await signedIn("lead-tech");
    const sys = await lead.post(`/api/stores/${co.store.id}/systems`, {
      name: "Produce case line",
      refrigerantId: "R-448A",
      fullCharge: { value: 20, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
    });
    const tech = await signedIn("technician");
    for (const [addedOn, value] of [
      ["2025-03-02", 15],
      ["2025-09-01", 10],
      ["2026-02-02", 15],
      ["2026-08-03", 10],
    ] as const) {
      const r = await tech.post(`/api/systems/${sys.body.id}/charge-additions`, {
        addedOn,
        amount: { value, unit: "lb" },
        reason: "Low receiver level",
      });
      expect(r.status).toBe(201);
    }
    const rec = (await (await signedIn("engineer")).get(`/api/systems/${sys.body.id}/records`)).body;
    // 25 lb / 20 lb = 125 % in both years, but only 2026 is a Part 84 year: report by 1 March 2027.
    // 2025 is listed, so the yearly totals add up with the charge added, and not judged (docs/decisions/0127).
    expect(rec.chronic.map((y: { year: number; chronic: boolean }) => [y.year, y.chronic])).toEqual([
      [2025, false],
      [2026, true],
    ]);
    expect(rec.chronic[0].notCountedKg).toBeCloseTo(25 * 0.45359237, 9); // NIST SP 811
    expect(rec.chronic[0].noPart).toMatch(/40 CFR 84 subpart C.*applies from 1 Jan 2026/);
    expect(rec.chronic[1]).toMatchObject({ noPart: null, notCountedKg: 0 });
    expect(
      rec.due.filter((d: { kind: string }) => d.kind === "chronic-leaker-report").map((d: { year: number }) => d.year),
    ).not.toContain(2025);
    const refused = await (await signedIn("engineer")).post(`/api/systems/${sys.body.id}/chronic-reports`, {
      year: 2025,
      filedOn: "2026-02-10",
    });
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.body.error.fields)).toEqual(["year"]);
  });
});
