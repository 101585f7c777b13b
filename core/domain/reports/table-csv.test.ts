import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { snakeCase, tableCsv } from "./table-csv";

describe("tableCsv", () => {
  it("names columns as the database does and writes instants in ISO 8601 UTC", () => {
    const csv = tableCsv(
      ["id", "fullChargeKg", "retiredAt", "warnings"],
      [{ id: "a", fullChargeKg: 45.359237, retiredAt: new Date("2026-03-01T12:00:00Z"), warnings: [{ code: "x" }] }],
    );
    const [header, row] = Papa.parse<string[]>(csv.trim()).data;
    expect(header).toEqual(["id", "full_charge_kg", "retired_at", "warnings"]);
    // 100 lb × 0.45359237 kg/lb (NIST SP 811, appendix B.8): the stored figure is written unrounded.
    expect(row).toEqual(["a", "45.359237", "2026-03-01T12:00:00.000Z", '[{"code":"x"}]']);
  });

  it("says in an instant column's name that it is UTC", () => {
    const csv = tableCsv(["id", "at"], [{ id: "a", at: new Date("2026-11-01T06:30:00Z") }], ["at"]);
    expect(Papa.parse<string[]>(csv.trim()).data).toEqual([
      ["id", "at_utc"],
      ["a", "2026-11-01T06:30:00.000Z"],
    ]);
    expect(tableCsv(["id", "voidedAt"], [], ["voidedAt"]).trim()).toBe("id,voided_at_utc");
  });

  it("keeps the header of an empty table and leaves a missing value empty", () => {
    expect(tableCsv(["id", "voidedAt"], []).trim()).toBe("id,voided_at");
    expect(tableCsv(["id", "voidedAt"], [{ id: "b", voidedAt: null }])).toBe("id,voided_at\r\nb,");
  });

  it("escapes text that a spreadsheet would run as a formula (OWASP CSV injection, decision 0025)", () => {
    const [, row] = Papa.parse<string[]>(tableCsv(["note"], [{ note: "=HYPERLINK(1)" }]).trim()).data;
    expect(row).toEqual(["'=HYPERLINK(1)"]);
  });

  it("turns camelCase into snake_case", () => {
    expect(snakeCase("automaticLeakDetection")).toBe("automatic_leak_detection");
    expect(snakeCase("id")).toBe("id");
  });
});
