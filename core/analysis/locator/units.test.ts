import { describe, expect, it } from "vitest";
import { HOURS_PER_YEAR, mgPerM3ToPpm, ppmToMgPerM3, wellMixedConcentration, wellMixedEmission } from "./units";

describe("ppm and mg/m³ by the ideal-gas molar volume", () => {
  it("uses 24.465 L/mol (25 °C, 101.325 kPa), close to the rounded 24.45 of the IMC/ASHRAE tables", () => {
    // IMC Table 1103.1 (from ASHRAE 34): R-134a RCL 50,000 ppm = 210 g/m³, converted at about 24.45 L/mol
    expect(ppmToMgPerM3(50_000, 102.03, 24.45) / 1000).toBeCloseTo(208.7, 1);
    expect(Math.abs(ppmToMgPerM3(50_000, 102.03) / 1000 - 210) / 210).toBeLessThan(0.01);
    // R-22 RCL 59,000 ppm = 210 g/m³ (same table)
    expect(Math.abs(ppmToMgPerM3(59_000, 86.47) / 1000 - 210) / 210).toBeLessThan(0.01);
    expect(mgPerM3ToPpm(ppmToMgPerM3(12.5, 97.6), 97.6)).toBeCloseTo(12.5, 12);
  });
});

describe("well-mixed room steady state C = G/(ACH·V) (Ott 2007, Exposure Analysis, ch. 18)", () => {
  it("reproduces the docs/reference/standards.md §7 example: 1 kg/yr of R-134a in a 30 m³ walk-in", () => {
    const mgPerH = 1e6 / HOURS_PER_YEAR;
    const c = wellMixedConcentration(mgPerH, 0.5, 30);
    expect(c).toBeCloseTo(7.6, 1);
    expect(mgPerM3ToPpm(c, 102.03)).toBeCloseTo(1.8, 1);
    expect(mgPerM3ToPpm(wellMixedConcentration(mgPerH, 0.1, 30), 102.03)).toBeCloseTo(9.1, 1);
  });

  it("inverts to the emission and rejects non-positive air change", () => {
    expect(wellMixedEmission(wellMixedConcentration(250, 2, 400), 2, 400)).toBeCloseTo(250, 9);
    expect(() => wellMixedConcentration(1, 0, 10)).toThrow(/positive/);
  });
});
