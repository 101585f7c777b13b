import { describe, expect, it } from "vitest";
import { getRefrigerant } from "../refrigerants/catalogue";
import { co2eTonnes, systemCo2e } from "./co2e";
import { EU_FGAS_PROFILE } from "./eu-fgas-profile";
import { fgasGroup, leakCheckInterval, nextInspectionDate } from "./leak-check-interval";

const r = getRefrigerant;
/** The kg of R-404A (GWP 3922 [S:E1]) that holds `t` tonnes CO2e. */
const kg404 = (t: number) => (t * 1000) / 3922;
const months = (kg: number, hasLeakDetection: boolean, id = "R-404A") => {
  const i = leakCheckInterval(EU_FGAS_PROFILE, r(id), kg, { hasLeakDetection });
  return i.required ? i.months : null;
};

describe("CO2 equivalent", () => {
  it("is kg × GWP / 1000", () => {
    // 2024/573 Art. 3 [S:E7]: 20 kg R-410A × 2088 = 41.76 t.
    expect(co2eTonnes(20, 2088)).toBeCloseTo(41.76, 12);
    const c = systemCo2e(EU_FGAS_PROFILE, r("R-410A"), 20);
    expect(c.known && c.tonnes).toBeCloseTo(41.76, 12);
    expect(c.known && c.gwp).toBe(2088);
    expect(() => co2eTonnes(-1, 2088)).toThrow(/^chargeKg/);
  });
});

describe("EU leak-check intervals from CO2e bands (517/2014 Art. 4, 2024/573 Art. 5)", () => {
  // docs/reference/standards.md §2 [S:E1]: ≥5 <50 t: 12 / 24 months; ≥50 <500 t: 6 / 12; ≥500 t: 3 / 6, LDS mandatory [S:E2,E5].
  it("puts exactly 5, 50 and 500 t in the upper band", () => {
    expect(months(kg404(5), false)).toBe(12);
    expect(months(kg404(5), true)).toBe(24);
    expect(months(kg404(50), false)).toBe(6);
    expect(months(kg404(50), true)).toBe(12);
    expect(months(kg404(500), false)).toBe(3);
    expect(months(kg404(500), true)).toBe(6);
    const top = leakCheckInterval(EU_FGAS_PROFILE, r("R-404A"), kg404(500), { hasLeakDetection: false });
    expect(top.required && top.ldsRequired).toBe(true);
    expect(top.required && top.amount).toBe(500);
  });
  it("keeps just-below charges in the lower band", () => {
    expect(months(kg404(4.999), false)).toBeNull();
    expect(months(kg404(49.999), false)).toBe(12);
    expect(months(kg404(499.999), false)).toBe(6);
    const mid = leakCheckInterval(EU_FGAS_PROFILE, r("R-404A"), kg404(499.999), { hasLeakDetection: false });
    expect(mid.required && mid.ldsRequired).toBe(false);
  });
  it("gives the 20 kg R-410A example 12 months, 24 with leak detection", () => {
    // 41.76 t [S:E7] lies in the 5–50 t band [S:E1].
    expect(months(20, false, "R-410A")).toBe(12);
    expect(months(20, true, "R-410A")).toBe(24);
  });
  it("writes the reason's figures in the company's number format, at sensible precision", () => {
    // 45.5 kg R-404A × 3922 / 1000 = 178.451 t (Art. 3 [S:E7]; GWP [S:E1]): the 50–500 t band, 6 months [S:E1].
    // Written "178,5" in a 1.234,5 company (docs/decisions/0047: one place from 10 to 1,000, common practice).
    const de = leakCheckInterval(EU_FGAS_PROFILE, r("R-404A"), 45.5, {
      hasLeakDetection: false,
      numberFormat: "1.234,5",
    });
    expect(de.reason).toBe("178,5 t CO2e is in the 50 to < 500 t CO2e band: every 6 months without leak detection");
    // 1,250 kg R-449A × 1397 = 1,746.25 t (AR4 with the 517/2014 HFO values, standards.md §3 [D]): whole tonnes, grouped.
    const big = leakCheckInterval(EU_FGAS_PROFILE, r("R-449A"), 1250, {
      hasLeakDetection: true,
      numberFormat: "1.234,5",
    });
    expect(big.reason).toMatch(/^1\.746 t CO2e is in the ≥ 500 t CO2e band: every 6 months with leak detection/);
    // 2.1 kg R-404A = 8.2362 t: "8,24 t" (two places from 1 to 10).
    const small = leakCheckInterval(EU_FGAS_PROFILE, r("R-404A"), 2.1, {
      hasLeakDetection: false,
      numberFormat: "1.234,5",
    });
    expect(small.reason).toMatch(/^8,24 t CO2e is in the 5 to < 50 t CO2e band/);
    // Without a format: the default 1,234.5.
    expect(leakCheckInterval(EU_FGAS_PROFILE, r("R-404A"), 2.1, { hasLeakDetection: false }).reason).toMatch(
      /^8\.24 t/,
    );
  });
  it("exempts labelled hermetically sealed equipment below 10 t", () => {
    // [S:E1] hermetically sealed equipment < 10 t CO2e is exempt.
    expect(
      leakCheckInterval(EU_FGAS_PROFILE, r("R-404A"), kg404(9.99), {
        hasLeakDetection: false,
        hermeticallySealed: true,
      }).required,
    ).toBe(false);
    expect(
      leakCheckInterval(EU_FGAS_PROFILE, r("R-404A"), kg404(10), { hasLeakDetection: false, hermeticallySealed: true })
        .required,
    ).toBe(true);
  });
  it("checks HFOs by kg from 1 kg", () => {
    // 2024/573 Art. 5 [S:E5]: HFOs from 1 kg, LDS from 100 kg; intervals 12/24, 6/12, 3/6 [M].
    expect(fgasGroup(r("R-1234yf"))).toBe("annex-II-hfo");
    expect(months(0.99, false, "R-1234yf")).toBeNull();
    expect(months(1, false, "R-1234yf")).toBe(12);
    expect(months(10, false, "R-1234ze(E)")).toBe(6);
    expect(months(100, true, "R-1234yf")).toBe(6);
  });
  it("leaves natural refrigerants and HCFCs out and counts HFC/HFO blends by CO2e", () => {
    for (const id of ["R-744", "R-290", "R-717", "R-22"])
      expect(leakCheckInterval(EU_FGAS_PROFILE, r(id), 1000, { hasLeakDetection: false }).required, id).toBe(false);
    expect(fgasGroup(r("R-455A"))).toBe("annex-I"); // contains R-32 (ASHRAE 34 [S:G3])
    // R-449A 1397 [M]: 10 kg → 13.97 t → 12 months.
    expect(months(10, false, "R-449A")).toBe(12);
  });
});

describe("next inspection date", () => {
  it("adds calendar months with month-end clamping", () => {
    // Clamping to the month end: common practice, no published source.
    expect(nextInspectionDate("2026-03-15", 12)).toBe("2027-03-15");
    expect(nextInspectionDate("2026-08-31", 6)).toBe("2027-02-28");
    expect(nextInspectionDate("2027-08-31", 6)).toBe("2028-02-29"); // 2028 is a leap year
    expect(nextInspectionDate("2026-11-30", 3)).toBe("2027-02-28");
    expect(() => nextInspectionDate("2026-11-31", 3)).toThrow(/^lastCheck: 2026-11-31 does not exist/);
  });
});
