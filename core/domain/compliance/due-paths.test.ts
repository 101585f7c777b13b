import { describe, expect, it } from "vitest";
import { getRefrigerant } from "../refrigerants/catalogue";
import { KG_PER_POUND } from "../units/mass";
import { systemStatus, type SystemRecords } from "./system-status";
import { US_FEDERAL_PROFILE } from "./us-federal-profile";

const lb = (n: number) => n * KG_PER_POUND; // NIST SP 811: 0.45359237 kg per lb exactly
const rack = (pounds: number, inService: string, extra: Partial<SystemRecords> = {}): SystemRecords => ({
  refrigerant: getRefrigerant("R-448A"),
  fullChargeKg: lb(pounds),
  applianceType: "commercial-refrigeration",
  automaticLeakDetection: false,
  enteredOn: inService,
  additions: [],
  repairedOn: [],
  pendingFollowUps: [],
  followUpVerifiedOn: [],
  leakChecks: [],
  ...extra,
});
const kinds = (rec: SystemRecords, today: string) =>
  systemStatus(US_FEDERAL_PROFILE, "annualizing", rec, today).due.map((d) => [d.kind, d.dueOn]);

describe("automatic leak detection is a due item while missing (40 CFR 84 subpart C, docs/reference/standards.md §1)", () => {
  // Required for commercial refrigeration of 1,500 lb or more [S:R4]; install dates [M]: within 30 days for
  // systems in service from 2026, by 1 Jan 2027 for 2017–2025.
  it("falls due 30 days after a 2026 in-service day, or on 1 Jan 2027 for a 2017–2025 system", () => {
    expect(kinds(rack(1600, "2026-03-01"), "2026-04-01")).toEqual([["automatic-leak-detection", "2026-03-31"]]);
    expect(kinds(rack(1600, "2020-06-01"), "2026-04-01")).toEqual([["automatic-leak-detection", "2027-01-01"]]);
    const s = systemStatus(US_FEDERAL_PROFILE, "annualizing", rack(1600, "2020-06-01"), "2026-04-01");
    expect(s.automaticLeakDetection).toMatchObject({ required: true, dueOn: "2027-01-01" });
  });
  it("is not due with detection installed, below 1,500 lb, or for a system in service before 2017", () => {
    expect(kinds(rack(1600, "2026-03-01", { automaticLeakDetection: true }), "2026-04-01")).toEqual([]);
    expect(kinds(rack(1400, "2026-03-01"), "2026-04-01")).toEqual([]);
    const old = systemStatus(US_FEDERAL_PROFILE, "annualizing", rack(1600, "2010-01-01"), "2026-04-01");
    expect(old.automaticLeakDetection).toMatchObject({ required: true, dueOn: null });
    expect(old.due).toEqual([]);
  });
});

describe("the failed-repair path: a retrofit-or-retire plan falls due (docs/reference/standards.md §1 [M])", () => {
  // Plan within 30 days, carried out within 1 year [M]; docs/decisions/0044-readings-and-research-notes.md.
  it("after a failed follow-up verification test", () => {
    const rec = rack(100, "2015-01-01", { failedFollowUps: [{ findingId: "f", on: "2026-05-10" }] });
    expect(kinds(rec, "2026-05-11")).toEqual([
      ["retrofit-or-retire-plan", "2026-06-09"],
      ["retrofit-or-retire", "2027-05-10"],
    ]);
    // The item names the failed test's day as every screen writes days.
    const plan = systemStatus(US_FEDERAL_PROFILE, "annualizing", rec, "2026-05-11").due[0];
    expect(plan.what).toBe("Retrofit-or-retire plan: the follow-up verification test of 10 May 2026 failed");
    // A retrofit on or after the failure closes both.
    const retrofitted = {
      ...rec,
      revisions: [
        { ...rec, inServiceOn: "2015-01-01", effectiveFrom: "2015-01-01", kind: "first" as const },
        {
          ...rec,
          refrigerant: getRefrigerant("R-454B"),
          inServiceOn: "2015-01-01",
          effectiveFrom: "2026-06-01",
          kind: "retrofit" as const,
        },
      ],
    };
    expect(kinds(retrofitted, "2026-06-02")).toEqual([]);
  });
  it("when the 30 days to repair pass without a repair", () => {
    // 5/100 ÷ (30/365) × 100 = 60.8 % on 3 Mar (84.102 [S:R7]) > 20 %: repair by 2 Apr [S:R4]; none by 10 Apr.
    const rec = rack(100, "2015-01-01", {
      additions: [
        { id: "a", date: "2026-02-01", amountKg: lb(10) },
        { id: "b", date: "2026-03-03", amountKg: lb(5) },
      ],
    });
    expect(kinds(rec, "2026-04-02").map(([k]) => k)).not.toContain("retrofit-or-retire-plan");
    expect(kinds(rec, "2026-04-10")).toEqual([
      ["repair", "2026-04-02"],
      ["retrofit-or-retire-plan", "2026-05-02"],
      ["inspection", "2027-03-03"],
      ["retrofit-or-retire", "2027-04-02"],
    ]);
  });
});
