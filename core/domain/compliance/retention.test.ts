import { describe, expect, it } from "vitest";
import { getRefrigerant } from "../refrigerants/catalogue";
import { KG_PER_POUND } from "../units/mass";
import { EU_FGAS_PROFILE } from "./eu-fgas-profile";
import { recordRetention } from "./retention";
import { systemStatus } from "./system-status";
import { US_FEDERAL_PROFILE } from "./us-federal-profile";

describe("record retention follows the rule profile", () => {
  it("keeps a retired system's records 3 years under US federal rules, 5 under EU F-gas", () => {
    // docs/reference/standards.md §1: records 3 years [S:R6,R7]; §2: at least 5 years, 2024/573 Art. 7 [S:E8b].
    expect(recordRetention(US_FEDERAL_PROFILE, "2027-02-28")).toMatchObject({ years: 3, keptUntil: "2030-02-28" });
    expect(recordRetention(EU_FGAS_PROFILE, "2028-02-29")).toMatchObject({ years: 5, keptUntil: "2033-02-28" });
    expect(recordRetention(US_FEDERAL_PROFILE, null).keptUntil).toBeNull();
  });

  it("counts from a finding closed after the retirement because the system left service (docs/decisions/0166)", () => {
    // The same 3 years [S:R6,R7], from the closing's day when it is later than the retirement day.
    expect(recordRetention(US_FEDERAL_PROFILE, "2026-04-30", "2026-06-15").keptUntil).toBe("2029-06-15");
    expect(recordRetention(US_FEDERAL_PROFILE, "2026-04-30", "2026-03-01").keptUntil).toBe("2029-04-30");
  });

  it("a retired system still owes the chronic-leaker report for a year it served, and nothing else", () => {
    const lb = (n: number) => n * KG_PER_POUND; // NIST SP 811: 0.45359237 kg per lb exactly
    const rec = {
      refrigerant: getRefrigerant("R-448A"),
      fullChargeKg: lb(100),
      applianceType: "commercial-refrigeration" as const,
      automaticLeakDetection: false,
      enteredOn: "2026-01-01",
      // 130 lb into 100 lb in 2026 = 130 % ≥ 125 % [S:R7]; the 90 lb in 33 days is also a breach.
      additions: [
        { id: "a", date: "2026-10-01", amountKg: lb(40) },
        { id: "b", date: "2026-11-03", amountKg: lb(90) },
      ],
      repairedOn: [],
      pendingFollowUps: [{ findingId: "f", repairedOn: "2026-11-20", initialTestOn: null }],
      followUpVerifiedOn: [],
      leakChecks: [],
    };
    const inService = systemStatus(US_FEDERAL_PROFILE, "annualizing", rec, "2027-01-10");
    expect(inService.due.map((d) => d.kind).sort()).toEqual([
      "chronic-leaker-report",
      "initial-test",
      "inspection",
      "repair",
      // The 30 days to repair passed on 3 Dec 2026 with no repair: the failed-repair path [M].
      "retrofit-or-retire",
      "retrofit-or-retire-plan",
    ]);
    const retired = systemStatus(US_FEDERAL_PROFILE, "annualizing", { ...rec, retiredOn: "2027-01-05" }, "2027-01-10");
    // Report by 1 March of the next year [S:R7].
    expect(retired.due.map((d) => [d.kind, d.dueOn])).toEqual([["chronic-leaker-report", "2027-03-01"]]);
    // Nor is a next inspection named, on the screen or in the statement, while the in-service one has one.
    expect(inService.nextInspection).not.toBeNull();
    expect(retired.nextInspection).toBeNull();
  });
});

describe("a retired EU system shows no next leak check (docs/decisions/0040)", () => {
  it("keeps the band and the interval, but names no next date once retired", () => {
    // 2.1 kg R-404A = 8.24 t CO2e (Art. 3 [S:E7]; GWP 3922 [S:E1]): every 12 months without leak detection [S:E1].
    const rec = {
      refrigerant: getRefrigerant("R-404A"),
      fullChargeKg: 2.1,
      applianceType: "commercial-refrigeration" as const,
      automaticLeakDetection: false,
      enteredOn: "2025-01-10",
      additions: [],
      repairedOn: [],
      pendingFollowUps: [],
      followUpVerifiedOn: [],
      leakChecks: [{ checkedOn: "2025-12-20", leakFound: false }],
    };
    const inService = systemStatus(EU_FGAS_PROFILE, "annualizing", rec, "2026-12-05");
    expect(inService.nextInspection?.dueOn).toBe("2026-12-20");
    const retired = systemStatus(EU_FGAS_PROFILE, "annualizing", { ...rec, retiredOn: "2026-12-05" }, "2026-12-05");
    expect(retired.nextInspection).toBeNull();
    expect(retired.due).toEqual([]);
    expect(retired.leakCheck?.applied.required && retired.leakCheck.applied.months).toBe(12);
  });
});
