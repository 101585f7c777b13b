import { describe, expect, it } from "vitest";
import { getRefrigerant } from "../refrigerants/catalogue";
import { KG_PER_POUND } from "../units/mass";
import { systemStatus, type SystemRecords } from "./system-status";
import type { SystemRevision } from "./system-revisions";
import { US_FEDERAL_PROFILE } from "./us-federal-profile";

const lb = (n: number) => n * KG_PER_POUND; // NIST SP 811: 0.45359237 kg per lb exactly
const revision = (effectiveFrom: string, refrigerantId: string, pounds: number, kind: SystemRevision["kind"]) => ({
  effectiveFrom,
  kind,
  refrigerant: getRefrigerant(refrigerantId),
  fullChargeKg: lb(pounds),
  applianceType: "commercial-refrigeration" as const,
  automaticLeakDetection: false,
  inServiceOn: "2015-04-01",
});
const base = (revisions: SystemRevision[]): SystemRecords => ({
  ...revisions.at(-1)!,
  enteredOn: "2015-04-01",
  additions: [],
  repairedOn: [],
  pendingFollowUps: [],
  followUpVerifiedOn: [],
  leakChecks: [],
  revisions,
});

describe("history does not change when a system is edited (docs/decisions/0043-system-revisions.md)", () => {
  it("each figure uses the full charge in force on its date", () => {
    const revisions = [revision("2015-04-01", "R-448A", 100, "first"), revision("2026-06-01", "R-448A", 200, "change")];
    const s = systemStatus(
      US_FEDERAL_PROFILE,
      "annualizing",
      {
        ...base(revisions),
        additions: [
          { id: "a", date: "2026-02-01", amountKg: lb(2) },
          { id: "b", date: "2026-04-02", amountKg: lb(10) },
          { id: "c", date: "2026-08-01", amountKg: lb(10) },
        ],
      },
      "2026-08-02",
    );
    // 84.102 annualizing [S:R7]: 10/100 ÷ (60/365) × 100 = 60.83 % with the 100 lb in force on 2 Apr
    // (30.42 % if the later 200 lb rewrote it); 10/200 ÷ (121/365) × 100 = 15.08 % on 1 Aug.
    expect(s.points.map((p) => Number(p.percent.toFixed(2)))).toEqual([2, 60.83, 15.08]);
    expect(s.points.map((p) => p.exceeds)).toEqual([false, true, false]);
  });

  it("a retrofit starts a new regime: past Part 82 breaches stay Part 82, and no figure counts across it", () => {
    // R-22 (ODS) 100 lb: 40 CFR 82 subpart F from 50 lb [S:R1]; retrofitted to R-448A on 1 May 2026:
    // 40 CFR 84 subpart C from 1 Jan 2026 [S:R4]. Thresholds 20 % commercial [S:R1,R4]; 30 days to repair [S:R4].
    const revisions = [revision("2015-04-01", "R-22", 100, "first"), revision("2026-05-01", "R-448A", 90, "retrofit")];
    const additions = [
      { id: "a", date: "2025-06-01", amountKg: lb(5) },
      { id: "b", date: "2025-09-01", amountKg: lb(10) },
      { id: "fill", date: "2026-05-01", amountKg: lb(90), excluded: "retrofit" as const },
      { id: "c", date: "2026-07-01", amountKg: lb(5) },
    ];
    const s = systemStatus(US_FEDERAL_PROFILE, "annualizing", { ...base(revisions), additions }, "2026-07-02");
    // 10/100 ÷ (92/365) × 100 = 39.67 % on R-22 under Part 82; 5/90 ÷ (61/365) × 100 = 33.24 % on R-448A under
    // Part 84, counting the days from the retrofit fill (which itself gives no figure, 82.157 [S:R1]).
    expect(s.points.map((p) => [p.date, p.partId, Number(p.percent.toFixed(2))])).toEqual([
      ["2025-06-01", "40-cfr-82-subpart-f", 5],
      ["2025-09-01", "40-cfr-82-subpart-f", 39.67],
      ["2026-07-01", "40-cfr-84-subpart-c", 33.24],
    ]);
    // The Part 82 breach ended with the retrofit; the new one is due 1 Jul + 30 = 31 Jul.
    expect(s.episodes.map((e) => [e.partId, e.repairedOn])).toEqual([
      ["40-cfr-82-subpart-f", "2026-05-01"],
      ["40-cfr-84-subpart-c", null],
    ]);
    expect(s.due.filter((d) => d.kind === "repair").map((d) => d.dueOn)).toEqual(["2026-07-31"]);
    // Without a recorded fill, the first figure after the retrofit is a first calculation (365 days [M]).
    const noFill = systemStatus(
      US_FEDERAL_PROFILE,
      "annualizing",
      { ...base(revisions), additions: additions.filter((a) => a.id !== "fill") },
      "2026-07-02",
    );
    expect(noFill.points.at(-1)).toMatchObject({ days: 365 });
  });

  it("inspections after a breach run in the regime of the breach: a retrofit ends the Part 82 run", () => {
    // Same rack. Under 100 lb (not ≥ 500 lb) the inspections after a breach are yearly until one period
    // below the threshold (82.157 / 84.106, from memory). The retrofit on 1 May 2026 ends the Part 82
    // breach of 1 Sep 2025; the Part 84 breach of 1 Jul 2026 starts its own run: due 1 Jul 2027.
    const revisions = [revision("2015-04-01", "R-22", 100, "first"), revision("2026-05-01", "R-448A", 90, "retrofit")];
    const additions = [
      { id: "a", date: "2025-06-01", amountKg: lb(5) },
      { id: "b", date: "2025-09-01", amountKg: lb(10) },
      { id: "fill", date: "2026-05-01", amountKg: lb(90), excluded: "retrofit" as const },
      { id: "c", date: "2026-07-01", amountKg: lb(5) },
    ];
    const s = systemStatus(US_FEDERAL_PROFILE, "annualizing", { ...base(revisions), additions }, "2026-07-02");
    expect(s.nextInspection).toMatchObject({ dueOn: "2027-07-01" });
    expect(s.nextInspection!.reason).toContain("since the breach of 1 Jul 2026");
    expect(s.nextInspection!.source).toContain("84.106");
    // Without a breach since the retrofit, no Part 82 inspection is owed on the retrofitted rack.
    const before = systemStatus(
      US_FEDERAL_PROFILE,
      "annualizing",
      { ...base(revisions), additions: additions.filter((a) => a.id !== "c") },
      "2026-07-02",
    );
    expect(before.nextInspection).toBeNull();
    // Before the retrofit the Part 82 run was owed: yearly from the breach of 1 Sep 2025.
    const unretrofitted = systemStatus(
      US_FEDERAL_PROFILE,
      "annualizing",
      { ...base(revisions.slice(0, 1)), additions: additions.slice(0, 2) },
      "2026-04-02",
    );
    expect(unretrofitted.nextInspection).toMatchObject({ dueOn: "2026-09-01" });
    expect(unretrofitted.nextInspection!.source).toContain("82.157");
  });
});
