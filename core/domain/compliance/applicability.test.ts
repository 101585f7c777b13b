import { describe, expect, it } from "vitest";
import { getRefrigerant } from "../refrigerants/catalogue";
import { poundsToKg } from "../units/mass";
import { applicableLeakRatePart, exceedsThreshold, leakRateThreshold } from "./applicability";
import { EU_FGAS_PROFILE } from "./eu-fgas-profile";
import { PART_82_SUBPART_F, PART_84_SUBPART_C, US_FEDERAL_PROFILE } from "./us-federal-profile";

const partFor = (id: string, kg: number, date = "2026-06-01") =>
  applicableLeakRatePart(US_FEDERAL_PROFILE, getRefrigerant(id), kg, date).part?.id ?? null;

describe("which part applies", () => {
  it("puts ozone-depleting refrigerants under Part 82 from 50 lb", () => {
    // 40 CFR 82.157(a) [S:R1]: full charge ≥ 50 lb; ODS only since 10 Apr 2020 [S:R2].
    expect(partFor("R-22", poundsToKg(50))).toBe("40-cfr-82-subpart-f");
    expect(partFor("R-22", poundsToKg(49.99))).toBeNull();
    expect(partFor("R-22", 22.68)).toBe("40-cfr-82-subpart-f"); // 22.68 kg = 50.0004 lb (NIST SP 811)
    expect(partFor("R-22", 22.67)).toBeNull(); // 49.978 lb
    // An HCFC below 50 lb is not moved into Part 84 by its GWP of 1810.
    expect(partFor("R-22", poundsToKg(30))).toBeNull();
  });
  it("puts HFCs and substitutes with GWP > 53 under Part 84 from 15 lb, from 1 Jan 2026", () => {
    // 40 CFR 84 subpart C [S:R4]: GWP > 53, full charge ≥ 15 lb, from 1 Jan 2026.
    expect(partFor("R-404A", poundsToKg(15), "2026-01-01")).toBe("40-cfr-84-subpart-c");
    expect(partFor("R-404A", poundsToKg(14.99), "2026-01-01")).toBeNull();
    expect(partFor("R-404A", poundsToKg(500), "2025-12-31")).toBeNull();
    expect(partFor("R-454B", poundsToKg(20))).toBe("40-cfr-84-subpart-c"); // GWP 466 [D]
    expect(partFor("R-448A", poundsToKg(20))).toBe("40-cfr-84-subpart-c");
  });
  it("leaves low-GWP refrigerants out", () => {
    // GWP ≤ 53: R-744 1 [S:G1], R-717 0, R-1234yf <1 (AR5), R-290 ~0.02 (AR6), R-600a 3 (517/2014) [M].
    for (const id of ["R-744", "R-717", "R-1234yf", "R-1234ze(E)", "R-290", "R-600a"])
      expect(partFor(id, poundsToKg(1000)), id).toBeNull();
    const a = applicableLeakRatePart(US_FEDERAL_PROFILE, getRefrigerant("R-744"), 500, "2026-06-01");
    expect(a.reason).toMatch(/GWP 1 is not above 53/);
  });
  it("finds no leak-rate regime under the EU profile", () => {
    expect(applicableLeakRatePart(EU_FGAS_PROFILE, getRefrigerant("R-404A"), 100, "2026-06-01").applies).toBe(false);
  });
});

describe("thresholds by appliance type", () => {
  it("reads 20 / 30 / 10 % from both parts", () => {
    // 40 CFR 82.157(c) [S:R1] and 84.106 [S:R4]: commercial 20 %, IPR 30 %, comfort cooling 10 %.
    for (const part of [PART_82_SUBPART_F, PART_84_SUBPART_C]) {
      expect(leakRateThreshold(part, "commercial-refrigeration").percent).toBe(20);
      expect(leakRateThreshold(part, "industrial-process").percent).toBe(30);
      expect(leakRateThreshold(part, "comfort-cooling").percent).toBe(10);
    }
    expect(() => leakRateThreshold(PART_82_SUBPART_F, "walk-in" as never)).toThrow(/^applianceType: must be one of/);
  });
  it("counts only a rate above the threshold as a breach", () => {
    // 40 CFR 82.157(d): repair when the leak rate *exceeds* the threshold.
    expect(exceedsThreshold(20, 20)).toBe(false);
    expect(exceedsThreshold(20.28, 20)).toBe(true);
  });
});
