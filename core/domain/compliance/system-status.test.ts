import { describe, expect, it } from "vitest";
import { getRefrigerant } from "../refrigerants/catalogue";
import { KG_PER_POUND } from "../units/mass";
import { inspectionRun, systemStatus, type SystemRecords } from "./system-status";
import { US_FEDERAL_PROFILE } from "./us-federal-profile";
import { EU_FGAS_PROFILE } from "./eu-fgas-profile";

const lb = (n: number) => n * KG_PER_POUND; // NIST SP 811: 0.45359237 kg per lb exactly

const base: SystemRecords = {
  refrigerant: getRefrigerant("R-448A"),
  fullChargeKg: lb(1150),
  applianceType: "commercial-refrigeration",
  automaticLeakDetection: false,
  enteredOn: "2026-01-01",
  additions: [],
  repairedOn: [],
  pendingFollowUps: [],
  followUpVerifiedOn: [],
  leakChecks: [],
};

describe("inspection runs after a breach (our reading of 'until N periods below', docs/reference/standards.md §1 [M])", () => {
  it("ends after N clean inspections in a row, and a new breach resets the count", () => {
    expect(inspectionRun(["2026-03-01"], [], 4)).toEqual({ start: "2026-03-01", lastCheck: null, clean: 0 });
    const clean = (on: string) => ({ checkedOn: on, leakFound: false });
    expect(
      inspectionRun(["2026-03-01"], [clean("2026-06-01"), clean("2026-09-01"), clean("2026-12-01")], 4)?.clean,
    ).toBe(3);
    expect(
      inspectionRun(
        ["2026-03-01"],
        [clean("2026-06-01"), clean("2026-09-01"), clean("2026-12-01"), clean("2027-03-01")],
        4,
      ),
    ).toBeNull();
    expect(
      inspectionRun(["2026-03-01", "2026-10-01"], [clean("2026-06-01"), clean("2026-09-01"), clean("2026-12-01")], 4),
    ).toEqual({ start: "2026-03-01", lastCheck: "2026-12-01", clean: 1 });
    expect(inspectionRun([], [clean("2026-06-01")], 1)).toBeNull();
  });
});

describe("system status", () => {
  it("puts a ≥ 500 lb commercial system on quarterly inspections from the breach, unless automatic leak detection watches it", () => {
    const rec = {
      ...base,
      additions: [
        { id: "a", date: "2026-02-01", amountKg: lb(40) },
        { id: "b", date: "2026-08-31", amountKg: lb(150) },
      ],
    };
    const s = systemStatus(US_FEDERAL_PROFILE, "annualizing", rec, "2026-09-10");
    // 150/1150 ÷ (211/365) × 100 = 22.56 % > 20 % (40 CFR 84.102 annualizing; 84.106 threshold [S:R4]).
    expect(s.latest?.percent).toBeCloseTo((150 / 1150 / (211 / 365)) * 100, 9);
    expect(s.unrepairedBreach?.repairDue).toBe("2026-09-30"); // 30 days [S:R4]
    // Quarterly for CR ≥ 500 lb [M]; 31 Aug + 3 months clamps to 30 Nov (calendar months).
    expect(s.nextInspection?.dueOn).toBe("2026-11-30");
    expect(
      systemStatus(US_FEDERAL_PROFILE, "annualizing", { ...rec, automaticLeakDetection: true }, "2026-09-10")
        .nextInspection,
    ).toBeNull();
    // A repair recorded on or after the day the rate was learned clears the repair deadline.
    const repaired = systemStatus(
      US_FEDERAL_PROFILE,
      "annualizing",
      { ...rec, repairedOn: ["2026-09-05"] },
      "2026-09-10",
    );
    expect(repaired.unrepairedBreach).toBeNull();
    expect(repaired.due.map((d) => d.kind)).toEqual(["inspection"]);
  });

  it("dates the follow-up verification test 10 days after a passed initial test", () => {
    const s = systemStatus(
      US_FEDERAL_PROFILE,
      "annualizing",
      { ...base, pendingFollowUps: [{ findingId: "f", repairedOn: "2026-02-25", initialTestOn: "2026-02-25" }] },
      "2026-02-26",
    );
    // 25 Feb + 10 days = 7 Mar in 2026 (not a leap year); follow-up within 10 days [M].
    expect(s.due).toEqual([expect.objectContaining({ kind: "follow-up-test", dueOn: "2026-03-07", findingId: "f" })]);
  });

  it("asks for the initial verification test on the repair day until a passed one is recorded", () => {
    const pending = { ...base, pendingFollowUps: [{ findingId: "f", repairedOn: "2028-02-29", initialTestOn: null }] };
    // [S:R8]: the initial verification test "as soon as practicable after the repair is completed": due the repair day.
    const s = systemStatus(US_FEDERAL_PROFILE, "annualizing", pending, "2028-03-01");
    expect(s.due).toEqual([
      expect.objectContaining({
        kind: "initial-test",
        dueOn: "2028-02-29",
        findingId: "f",
        what: "Initial verification test after the repair of 29 Feb 2028",
      }),
    ]);
    // Once it passed (1 Mar 2028), the follow-up is due 10 days later [M]: 11 Mar.
    const passed = systemStatus(
      US_FEDERAL_PROFILE,
      "annualizing",
      { ...base, pendingFollowUps: [{ findingId: "f", repairedOn: "2028-02-29", initialTestOn: "2028-03-01" }] },
      "2028-03-02",
    );
    expect(passed.due.map((d) => [d.kind, d.dueOn])).toEqual([["follow-up-test", "2028-03-11"]]);
  });

  it("closes the chronic-leaker report item once that year's report is filed", () => {
    // 125 % rule [S:R7]: 700 + 800 lb into 1,150 lb in 2026 = 130 %; report by 1 March 2027.
    const rec = {
      ...base,
      additions: [
        { id: "a", date: "2026-03-01", amountKg: lb(700) },
        { id: "b", date: "2026-11-30", amountKg: lb(800) },
      ],
    };
    const open = systemStatus(US_FEDERAL_PROFILE, "annualizing", rec, "2027-01-10");
    expect(open.due.filter((d) => d.kind === "chronic-leaker-report").map((d) => [d.dueOn, d.year])).toEqual([
      ["2027-03-01", 2026],
    ]);
    const filed = systemStatus(
      US_FEDERAL_PROFILE,
      "annualizing",
      { ...rec, chronicReportsFiled: [2026] },
      "2027-01-10",
    );
    expect(filed.due.some((d) => d.kind === "chronic-leaker-report")).toBe(false);
    expect(filed.chronic.find((y) => y.year === 2026)?.chronic).toBe(true); // the record itself stays
  });
});

describe("added per calendar year before a leak-repair part applied (docs/decisions/0127)", () => {
  // Part 84 applies to HFCs (GWP > 53) from 1 Jan 2026 [S:R4]; Part 82 leak repair covers ODS only since
  // 10 Apr 2020 [S:R1,R2]; 125 % in a calendar year makes a chronic leaker [S:R7] (docs/reference/standards.md §1).
  const rec = {
    ...base,
    enteredOn: "2024-03-01",
    additions: [
      { id: "a", date: "2025-04-20", amountKg: lb(800) },
      { id: "b", date: "2025-10-02", amountKg: lb(820) },
      { id: "c", date: "2026-02-09", amountKg: lb(150) },
    ],
  };

  it("lists an HFC rack's 2025 as not judged, with the rule's reason, and judges 2026 alone", () => {
    const s = systemStatus(US_FEDERAL_PROFILE, "annualizing", rec, "2026-03-01");
    expect(s.chronic.map((y) => [y.year, y.partId, y.chronic, Math.round(y.percent)])).toEqual([
      [2025, null, false, 0],
      [2026, "40-cfr-84-subpart-c", false, 13],
    ]);
    // 1,620 lb into a 1,150 lb rack would be 141 %: no chronic-leaker report is due for 2025.
    expect(s.chronic[0].notCountedKg).toBeCloseTo(lb(1620), 9);
    expect(s.chronic[0].noPart).toMatch(/84.*applies from 2026-01-01/);
    expect(s.due.some((d) => d.kind === "chronic-leaker-report")).toBe(false);
    expect(s.chronic[1].noPart).toBeNull();
  });

  it("lists no years at all under a profile without leak-repair parts (EU F-gas has no chronic-leaker report)", () => {
    const s = systemStatus(EU_FGAS_PROFILE, "annualizing", rec, "2026-03-01");
    expect(s.chronic).toEqual([]);
  });
});
