import { describe, expect, it } from "vitest";
import { getRefrigerant } from "../refrigerants/catalogue";
import { poundsToKg } from "../units/mass";
import { tonnesForComparison } from "./co2e";
import { copyProfile, validateRuleProfile } from "./custom-profile";
import { EU_FGAS_PROFILE } from "./eu-fgas-profile";
import { leakCheckInterval } from "./leak-check-interval";
import { leakRateThreshold } from "./applicability";
import type { RuleProfile } from "./rule-profile";
import { US_FEDERAL_PROFILE } from "./us-federal-profile";

/** Every `{ value, source }` pair in a profile. */
function sourcedValues(node: unknown, path = ""): { path: string; source: unknown }[] {
  if (node === null || typeof node !== "object") return [];
  const o = node as Record<string, unknown>;
  const here = "value" in o && "source" in o ? [{ path, source: o.source }] : [];
  return [...here, ...Object.entries(o).flatMap(([k, v]) => (k === "value" ? [] : sourcedValues(v, `${path}.${k}`)))];
}

describe("built-in rule profiles", () => {
  it("are valid and carry a source tag on every value", () => {
    for (const p of [US_FEDERAL_PROFILE, EU_FGAS_PROFILE]) {
      expect(() => validateRuleProfile(p)).not.toThrow();
      const values = sourcedValues(p);
      expect(values.length).toBeGreaterThanOrEqual(6);
      // Tags as in docs/reference/standards.md: [S:id], [M] or [D].
      for (const v of values) expect(String(v.source), `${p.id}${v.path}`).toMatch(/\[(S:[A-Za-z0-9,]+|M|D)\]/);
    }
  });
  it("hold the record retention periods", () => {
    // [S:R6,R7] 3 years US; [S:E8b] 5 years EU.
    expect(US_FEDERAL_PROFILE.recordRetentionYears.value).toBe(3);
    expect(EU_FGAS_PROFILE.recordRetentionYears.value).toBe(5);
  });
});

describe("custom profiles", () => {
  it("are deep copies whose edits change the results, not the original", () => {
    const custom = copyProfile(US_FEDERAL_PROFILE, "acme-strict", "Company rule: 15 % commercial");
    custom.leakRateParts[1].thresholds["commercial-refrigeration"] = {
      value: 15,
      source: "company policy, set by the owner",
    };
    expect(leakRateThreshold(custom.leakRateParts[1], "commercial-refrigeration").percent).toBe(15);
    expect(leakRateThreshold(US_FEDERAL_PROFILE.leakRateParts[1], "commercial-refrigeration").percent).toBe(20);
    expect(custom.kind).toBe("custom");
    expect(custom.basedOn).toBe("us-federal");
    expect(copyProfile(custom, "b", "B").basedOn).toBe("us-federal");
  });
  it("move band edges for every function that reads them", () => {
    const custom = copyProfile(EU_FGAS_PROFILE, "eu-strict", "Stricter checks");
    custom.leakChecks!.co2eBands.value[0] = { ...custom.leakChecks!.co2eBands.value[0], monthsWithoutLds: 6 };
    const kg = 20; // 20 kg R-410A = 41.76 t [S:E7]
    const custom410 = leakCheckInterval(custom, getRefrigerant("R-410A"), kg, { hasLeakDetection: false });
    const eu410 = leakCheckInterval(EU_FGAS_PROFILE, getRefrigerant("R-410A"), kg, { hasLeakDetection: false });
    expect(custom410.required && custom410.months).toBe(6);
    expect(eu410.required && eu410.months).toBe(12);
  });
  it("are refused with the field named when an edit is wrong", () => {
    const bad = (edit: (p: RuleProfile) => void) => {
      const p = copyProfile(US_FEDERAL_PROFILE, "x", "X");
      edit(p);
      return () => validateRuleProfile(p);
    };
    expect(bad((p) => (p.leakRateParts[0].thresholds["comfort-cooling"].value = -5))).toThrow(
      /^leakRateParts\[0\]\.thresholds\.comfort-cooling\.value: must be a number from 0 to 1000/,
    );
    expect(bad((p) => (p.leakRateParts[1].repairDays = { value: 30.5, source: "x" }))).toThrow(
      /repairDays\.value: must be a whole number/,
    );
    expect(bad((p) => (p.leakRateParts[1].repairDays = { value: 45, source: " " }))).toThrow(
      /repairDays\.source: every rule value needs its source/,
    );
    expect(bad((p) => (p.leakRateParts[1].effectiveFrom = { value: "2026-02-30", source: "x" }))).toThrow(
      /effectiveFrom\.value: 2026-02-30 does not exist/,
    );
    const eu = copyProfile(EU_FGAS_PROFILE, "y", "Y");
    eu.leakChecks!.co2eBands.value[0] = { ...eu.leakChecks!.co2eBands.value[0], to: 40 };
    expect(() => validateRuleProfile(eu)).toThrow(
      /^leakChecks\.co2eBands\.value\[0\]\.to: must equal the next band's from \(50\)/,
    );
    expect(bad((p) => (p.leakRateParts[0].inspectionsAfterBreach!.value.largeEveryMonths = 0))).toThrow(
      /inspectionsAfterBreach\.value\.largeEveryMonths: must be a whole number/,
    );
    expect(() => copyProfile(US_FEDERAL_PROFILE, "", "X")).toThrow(/^id: is empty/);
  });
});

describe("binary noise at band edges", () => {
  it("treats a last-bit shortfall as the edge but keeps a real shortfall below", () => {
    expect(tonnesForComparison(4.999999999999999)).toBe(5);
    expect(tonnesForComparison(50.00000000000001)).toBe(50);
    // 3.4965 kg R-134a × 1430 (AR4 [S:G1]) = 4.999995 t: five grams short, so no check is required.
    expect(
      leakCheckInterval(EU_FGAS_PROFILE, getRefrigerant("R-134a"), 3.4965, { hasLeakDetection: false }).required,
    ).toBe(false);
    expect(poundsToKg(15) * (1 - 1e-9)).toBeLessThan(poundsToKg(15));
  });
});
