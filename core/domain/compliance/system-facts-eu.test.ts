import { describe, expect, it } from "vitest";
import { getRefrigerant } from "../refrigerants/catalogue";
import { EU_FGAS_PROFILE } from "./eu-fgas-profile";
import { systemStatus, type SystemRecords } from "./system-status";
import { US_FEDERAL_PROFILE } from "./us-federal-profile";

// R-404A's GWP 3922 (517/2014 and 2024/573 Annex I, AR4; docs/reference/standards.md §2 [S:E1]).
const kg404 = (t: number) => (t * 1000) / 3922;

const eu = (over: Partial<SystemRecords>): SystemRecords => ({
  refrigerant: getRefrigerant("R-404A"),
  fullChargeKg: kg404(8),
  applianceType: "commercial-refrigeration",
  automaticLeakDetection: false,
  enteredOn: "2025-03-10",
  additions: [],
  repairedOn: [],
  pendingFollowUps: [],
  followUpVerifiedOn: [],
  leakChecks: [],
  ...over,
});
const status = (rec: SystemRecords, today = "2026-06-01") => systemStatus(EU_FGAS_PROFILE, "annualizing", rec, today);
const kinds = (rec: SystemRecords, today?: string) => status(rec, today).due.map((d) => d.kind);

describe("hermetically sealed equipment (EU, docs/reference/standards.md §2 [S:E1])", () => {
  it("exempts a labelled hermetic unit below 10 t CO2e from periodic leak checks", () => {
    // 2.04 kg R-404A × 3922 = 8 t CO2e: without the exemption the 5–50 t band, every 12 months [S:E1].
    const plain = status(eu({}));
    expect(plain.nextInspection?.dueOn).toBe("2026-03-10");
    expect(kinds(eu({}))).toEqual(["inspection"]);
    const sealed = status(eu({ hermeticallySealed: true }));
    expect(sealed.nextInspection).toBeNull();
    expect(sealed.leakCheck?.applied).toEqual({
      required: false,
      reason: "hermetically sealed and below 10 t CO2e",
    });
    expect(sealed.due).toEqual([]);
  });

  it("does not exempt a hermetic unit of 10 t CO2e or more", () => {
    // Exactly 10 t is not "< 10 t" [S:E1]: the 5–50 t band, every 12 months.
    const at10 = status(eu({ fullChargeKg: kg404(10), hermeticallySealed: true }));
    expect(at10.leakCheck?.applied.required).toBe(true);
    expect(at10.nextInspection?.dueOn).toBe("2026-03-10");
  });
});

describe("the leak detection system's own check (EU, docs/reference/standards.md §2 [S:E2,E5])", () => {
  // 600 t CO2e of R-404A: the ≥ 500 t band, where an LDS is mandatory and checked every 12 months.
  const rack = (over: Partial<SystemRecords>) =>
    eu({ fullChargeKg: kg404(600), automaticLeakDetection: true, enteredOn: "2025-03-10", ...over });

  it("falls due 12 months after the in-service day while no check is recorded", () => {
    const d = status(rack({})).due.find((x) => x.kind === "leak-detection-check");
    expect(d).toMatchObject({ dueOn: "2026-03-10" });
    expect(d?.what).toBe("Check of the leak detection system (at least every 12 months; in service since 10 Mar 2025)");
    expect(d?.source).toMatch(/^\[S:E2,E5\]/);
  });

  it("runs from the latest check that found it working; a check that found a fault does not restart it", () => {
    const checks = [
      { checkedOn: "2026-02-20", working: true },
      { checkedOn: "2026-05-04", working: false },
    ];
    const d = status(rack({ leakDetectionChecks: checks })).due.find((x) => x.kind === "leak-detection-check");
    expect(d?.dueOn).toBe("2027-02-20");
    expect(d?.what).toContain("the check of 4 May 2026 found a fault");
  });

  it("applies to HFOs from 100 kg ([S:E5]), not below, and not to a 499 t system", () => {
    const hfo = (kg: number) => kinds(eu({ refrigerant: getRefrigerant("R-1234ze(E)"), fullChargeKg: kg }));
    expect(hfo(100)).toContain("leak-detection-check");
    expect(hfo(99.9)).not.toContain("leak-detection-check");
    expect(kinds(eu({ fullChargeKg: kg404(499.9), automaticLeakDetection: true }))).not.toContain(
      "leak-detection-check",
    );
  });

  it("takes the interval from the profile; a custom profile saved before the field existed reads 12 months", () => {
    const leakChecks = EU_FGAS_PROFILE.leakChecks!;
    const ownSix = {
      ...EU_FGAS_PROFILE,
      leakChecks: { ...leakChecks, ldsCheckMonths: { value: 6, source: "company policy" } },
    };
    const { ldsCheckMonths: _dropped, ...older } = leakChecks;
    const olderProfile = { ...EU_FGAS_PROFILE, leakChecks: older };
    const dueOn = (profile: typeof EU_FGAS_PROFILE) =>
      systemStatus(profile, "annualizing", rack({}), "2026-06-01").due.find((x) => x.kind === "leak-detection-check")
        ?.dueOn;
    expect(dueOn(ownSix)).toBe("2025-09-10");
    expect(dueOn(olderProfile)).toBe("2026-03-10");
  });

  it("says when the mandatory detection system is not recorded on the system", () => {
    const d = status(rack({ automaticLeakDetection: false })).due.find((x) => x.kind === "leak-detection-check");
    expect(d?.what).toContain("none is recorded on the system");
  });

  it("is owed by no retired system, and never under the US profile (Part 84 states no such check we hold a source for)", () => {
    expect(kinds(rack({ retiredOn: "2026-01-15" }))).toEqual([]);
    const us = systemStatus(US_FEDERAL_PROFILE, "annualizing", rack({}), "2026-06-01");
    expect(us.due.map((x) => x.kind)).not.toContain("leak-detection-check");
  });
});
