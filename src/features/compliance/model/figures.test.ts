import { describe, expect, it } from "vitest";
import type { DueItem } from "#core/contracts/compliance";
import { arrangeDue, daysInWords, formatMass, formatPercent } from "./figures";

const item = (over: Partial<DueItem>): DueItem => ({
  kind: "repair",
  what: "x",
  dueOn: "2026-05-01",
  state: "upcoming",
  daysLeft: 3,
  source: "s",
  storeId: "a",
  storeName: "A",
  systemId: null,
  systemName: null,
  findingId: null,
  detectorId: null,
  link: "/",
  ...over,
});

describe("Today figures", () => {
  it("shows kg as lb with the exact factor (NIST SP 811: 1 lb = 0.45359237 kg)", () => {
    expect(formatMass(0.45359237 * 150, "lb", "1,234.5")).toBe("150.0 lb");
    expect(formatMass(68.0388555, "kg", "1,234.5")).toBe("68.04 kg");
  });

  it("groups masses and percentages in the company's number format, as CLDR writes de-DE and fr-FR (Intl.NumberFormat)", () => {
    const de = new Intl.NumberFormat("de-DE", { minimumFractionDigits: 1, maximumFractionDigits: 1 });
    const fr = new Intl.NumberFormat("fr-FR", { minimumFractionDigits: 2, maximumFractionDigits: 2 });
    // 1,500 lb of charge is 680.388555 kg (NIST SP 811 factor).
    expect(formatMass(0.45359237 * 1500, "lb", "1.234,5")).toBe(`${de.format(1500)} lb`);
    expect(formatMass(0.45359237 * 1500, "lb", "1.234,5")).toBe("1.500,0 lb");
    expect(formatMass(1234.567, "kg", "1 234,5")).toBe(`${fr.format(1234.567)} kg`);
    expect(formatPercent(125.04, "1.234,5")).toBe("125,0 %");
  });

  it("filters by store and sorts by due date, store or kind, undated first", () => {
    const list = [
      item({ what: "b", dueOn: "2026-05-03", storeId: "b", storeName: "B" }),
      item({ what: "n", dueOn: null, kind: "detector-check", storeId: null, storeName: null }),
      item({ what: "a", kind: "inspection" }),
    ];
    expect(arrangeDue(list, null, "due").map((i) => i.what)).toEqual(["n", "a", "b"]);
    expect(arrangeDue(list, "b", "due").map((i) => i.what)).toEqual(["b"]);
    expect(arrangeDue(list, null, "kind").map((i) => i.what)).toEqual(["n", "a", "b"]);
    expect(daysInWords(-2)).toBe("2 days late");
    expect(daysInWords(1)).toBe("in 1 day");
  });
});
