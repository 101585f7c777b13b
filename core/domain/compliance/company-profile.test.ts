import { describe, expect, it } from "vitest";
import { ruleProfileSchema } from "../../contracts/rule-profile";
import { leakRateThreshold } from "./applicability";
import { profileFor, startCustomProfile } from "./company-profile";
import { validateRuleProfile } from "./custom-profile";
import { EU_FGAS_PROFILE } from "./eu-fgas-profile";
import { US_FEDERAL_PROFILE } from "./us-federal-profile";

describe("the company's profile", () => {
  it("names the built-in profiles and a company's own custom one", () => {
    expect(profileFor("us-federal")).toBe(US_FEDERAL_PROFILE);
    expect(profileFor("eu-fgas")).toBe(EU_FGAS_PROFILE);
    const own = startCustomProfile("eu-fgas");
    own.recordRetentionYears = { value: 7, source: "company policy: 7 years for insurers" };
    expect(profileFor("custom", own).recordRetentionYears.value).toBe(7);
    // Chosen but never saved: an unedited copy of US federal (20 % commercial, 40 CFR 84.106 [S:R4]).
    const fallback = profileFor("custom", null);
    expect(fallback.kind).toBe("custom");
    expect(leakRateThreshold(fallback.leakRateParts[1], "commercial-refrigeration").percent).toBe(20);
  });

  it("starts custom profiles as copies both checks accept, edits never reaching the original", () => {
    for (const from of ["us-federal", "eu-fgas"] as const) {
      const p = startCustomProfile(from);
      expect(p).toMatchObject({ id: "custom", kind: "custom", basedOn: from });
      expect(() => validateRuleProfile(p)).not.toThrow();
      const parsed = ruleProfileSchema.safeParse(p);
      expect(parsed.success, JSON.stringify(parsed.error?.issues[0])).toBe(true);
    }
    const p = startCustomProfile("us-federal");
    p.leakRateParts[0].repairDays.value = 10;
    expect(US_FEDERAL_PROFILE.leakRateParts[0].repairDays.value).toBe(30);
  });

  it("names the field when the contract refuses an edit", () => {
    const issues = (edit: (p: ReturnType<typeof startCustomProfile>) => void) => {
      const p = structuredClone(startCustomProfile("eu-fgas"));
      edit(p);
      const r = ruleProfileSchema.safeParse(p);
      return r.success ? [] : r.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
    };
    // Bands ascend: 5–50–500 t [S:E1]; an upper edge below its lower one is named at that band.
    expect(issues((p) => (p.leakChecks!.co2eBands.value[1].to = 40))).toEqual([
      "leakChecks.co2eBands.value.1.to: must be above the band's lower edge (50)",
      "leakChecks.co2eBands.value.2.from: must equal the band below's upper edge (40), so bands ascend without gaps or overlaps",
    ]);
    expect(issues((p) => (p.leakChecks!.co2eBands.value[2].to = 1000))).toEqual([
      "leakChecks.co2eBands.value.2.to: must be empty (open) for the top band",
    ]);
    expect(issues((p) => (p.leakChecks!.co2eBands.value[0].monthsWithLds = 6))).toEqual([
      "leakChecks.co2eBands.value.0.monthsWithLds: must be at least the interval without a leak detection system",
    ]);
    expect(issues((p) => (p.leakChecks!.recheckAfterRepairMonths.value = 0))).toEqual([
      "leakChecks.recheckAfterRepairMonths.value: must be at least 1 month",
    ]);
    expect(issues((p) => (p.name = ""))).toEqual(["name: is required"]);
  });
});
