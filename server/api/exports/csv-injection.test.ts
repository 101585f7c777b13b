import { afterAll, beforeAll, describe, expect, it } from "vitest";
import Papa from "papaparse";
import { createTestApp, signIn, type TestApp } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { readingsCsv } from "#core/domain/reports/readings-csv";

// OWASP "CSV Injection": a cell that begins with =, +, -, @, tab or carriage return is read as a
// formula by spreadsheets; such free-text cells are prefixed with a single quote. Numbers stay numbers.

const HOSTILE = ['=HYPERLINK("http://example.invalid","x")', "+1+2", "-2+3", "@SUM(A1)", "\t=1", "\r=1", "=1\n+2"];

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Hollyhock Foods");
});
afterAll(() => t.close());

const cells = (csv: string) => Papa.parse<string[]>(csv, { skipEmptyLines: true }).data;

describe("readings CSV", () => {
  it("escapes formula-leading notes and keeps negative coordinates and ppm as numbers", () => {
    const csv = readingsCsv(
      HOSTILE.map((note, i) => ({
        id: `r${i}`,
        takenAt: new Date(Date.UTC(2026, 2, 4, 14, 5, i)),
        t: i,
        raw: { x: -1.5, y: 2 },
        corrected: { x: -1.25, y: 2 },
        ppm: 12.5,
        atLeast: false,
        samplePoint: "grille",
        note,
        flags: [],
      })),
      "m",
      "America/New_York",
    );
    const [head, ...rows] = cells(csv);
    const note = head.indexOf("note");
    expect(rows.map((r) => r[note])).toEqual(HOSTILE.map((h) => `'${h}`));
    for (const r of rows) {
      expect(r[head.indexOf("raw_x_m")]).toBe("-1.5");
      expect(r[head.indexOf("corrected_x_m")]).toBe("-1.25");
      expect(r[head.indexOf("ppm")]).toBe("12.5");
    }
  });
});

describe("records CSV", () => {
  it("escapes formula-leading names, reasons and notes; amounts stay numbers", async () => {
    const lead = await signIn(t.app, co.people["lead-tech"]);
    const systemId = (
      await lead.post(`/api/stores/${co.store.id}/systems`, {
        name: "=cmd|' /C calc'!A0",
        refrigerantId: "R-448A",
        fullCharge: { value: 100, unit: "lb" },
        applianceType: "commercial-refrigeration",
        automaticLeakDetection: false,
      })
    ).body.id;
    const tech = await signIn(t.app, co.people.technician);
    for (const [i, reason] of HOSTILE.slice(0, 4).entries())
      expect(
        (
          await tech.post(`/api/systems/${systemId}/charge-additions`, {
            addedOn: `2026-02-0${i + 1}`,
            amount: { value: 10, unit: "lb" },
            reason,
          })
        ).status,
      ).toBe(201);
    const res = await tech.get(`/api/systems/${systemId}/records.csv`);
    expect(res.status).toBe(200);
    const [head, ...all] = cells(res.text);
    const col = (name: string) => head.indexOf(name);
    // The system's first revision has a row too (decision 0126); its name is escaped like the others.
    for (const r of all) expect(r[col("system")]).toBe("'=cmd|' /C calc'!A0");
    const rows = all.filter((r) => r[col("record")] === "charge added");
    expect(rows.map((r) => r[col("reason")]).sort()).toEqual(
      HOSTILE.slice(0, 4)
        .map((h) => `'${h}`)
        .sort(),
    );
    for (const r of rows) {
      expect(r[col("system")]).toBe("'=cmd|' /C calc'!A0");
      expect(r[col("amount_kg")]).toMatch(/^\d+(\.\d+)?$/);
      expect(r[col("amount_lb")]).toBe("10");
    }
  });
});
