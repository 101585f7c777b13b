import { describe, expect, it } from "vitest";
import { getRefrigerant } from "../refrigerants/catalogue";
import { KG_PER_POUND } from "../units/mass";
import { groupAdditions } from "./leak-groups";
import { leakRateHistory } from "./leak-rate";
import { systemStatus, type SystemRecords } from "./system-status";
import { PART_84_SUBPART_C, US_FEDERAL_PROFILE } from "./us-federal-profile";

const lb = (n: number) => n * KG_PER_POUND; // NIST SP 811: 0.45359237 kg per lb exactly
const add = (id: string, date: string, pounds: number, findingId: string | null = null) => ({
  id,
  date,
  amountKg: lb(pounds),
  findingId,
});
// R-448A, 100 lb, commercial: 40 CFR 84 subpart C from 1 Jan 2026, 20 % threshold, repair in 30 days [S:R4].
const rack: SystemRecords = {
  refrigerant: getRefrigerant("R-448A"),
  fullChargeKg: lb(100),
  applianceType: "commercial-refrigeration",
  automaticLeakDetection: false,
  enteredOn: "2026-01-01",
  additions: [],
  repairedOn: [],
  pendingFollowUps: [],
  followUpVerifiedOn: [],
  leakChecks: [],
};
const status = (rec: Partial<SystemRecords>, today: string) =>
  systemStatus(US_FEDERAL_PROFILE, "annualizing", { ...rack, ...rec }, today);

describe("the repair clock runs from the first exceedance of a breach episode (docs/decisions/0041-repair-clock.md)", () => {
  // 84.102 annualizing formula (docs/reference/standards.md §1 [S:R7]); 30 days to repair, 84.106 [S:R4];
  // "from the first exceedance, until a repair on or after it" is our reading (docs/decisions/0041).
  const additions = [add("a", "2026-02-01", 10), add("b", "2026-03-03", 5), add("c", "2026-03-23", 5)];

  it("a second exceedance before the repair keeps the first one's deadline", () => {
    const s = status({ additions }, "2026-03-24");
    // 5/100 ÷ (30/365) × 100 = 60.83 % on 3 Mar; 5/100 ÷ (20/365) × 100 = 91.25 % on 23 Mar: both above 20 %.
    expect(s.points.map((p) => Number(p.percent.toFixed(2)))).toEqual([10, 60.83, 91.25]);
    expect(s.episodes).toHaveLength(1);
    // 3 Mar + 30 days = 2 Apr, not 23 Mar + 30 = 22 Apr.
    expect(s.unrepairedBreach?.date).toBe("2026-03-03");
    expect(s.due.find((d) => d.kind === "repair")?.dueOn).toBe("2026-04-02");
    expect(s.points.filter((p) => p.exceeds).map((p) => p.repairDue)).toEqual(["2026-04-02", "2026-04-02"]);
    // A single addition's figure is its own clock start: the item names only the episode's first exceedance.
    expect(s.due.find((d) => d.kind === "repair")?.what).toBe(
      "Repair: leak rate 60.8 % on 3 Mar 2026 is above 20 % (first of 2 exceedances before a repair; the deadline runs from the first)",
    );
  });

  it("a repair on or after the first exceedance closes the episode; a later exceedance opens a new one", () => {
    const repaired = status({ additions, repairedOn: ["2026-03-25"] }, "2026-03-26");
    expect(repaired.unrepairedBreach).toBeNull();
    expect(repaired.episodes[0].repairedOn).toBe("2026-03-25");
    // 5 lb 42 days after 23 Mar: 5/100 ÷ (42/365) × 100 = 43.45 % → a new episode, due 4 May + 30 = 3 Jun.
    const again = status(
      { additions: [...additions, add("d", "2026-05-04", 5)], repairedOn: ["2026-03-25"] },
      "2026-05-05",
    );
    expect(again.episodes.map((e) => [e.first.date, e.repairDue, e.repairedOn])).toEqual([
      ["2026-03-03", "2026-04-02", "2026-03-25"],
      ["2026-05-04", "2026-06-03", null],
    ]);
    expect(again.due.find((d) => d.kind === "repair")?.dueOn).toBe("2026-06-03");
  });

  it("a repair recorded before the exceedance does not close it", () => {
    const s = status({ additions, repairedOn: ["2026-02-15"] }, "2026-03-24");
    expect(s.due.find((d) => d.kind === "repair")?.dueOn).toBe("2026-04-02");
  });
});

describe("additions for the same leak are one calculation (docs/reference/standards.md §1 [M]; docs/decisions/0042-same-leak-additions.md)", () => {
  const rules = {
    maxDaysSinceLastAddition: PART_84_SUBPART_C.maxDaysSinceLastAddition.value,
    firstCalculationDays: PART_84_SUBPART_C.firstCalculationDays.value,
    rollingWindowDays: PART_84_SUBPART_C.rollingWindowDays.value,
  };
  const topUps = [add("a", "2026-02-01", 2), add("b", "2026-04-01", 3, "F"), add("c", "2026-04-02", 3, "F")];

  it("two visits a day apart for the same finding give one figure, not 1,095 %", () => {
    const alone = leakRateHistory({
      fullChargeKg: lb(100),
      method: "annualizing",
      rules,
      additions: topUps.map((a) => ({ ...a, findingId: null })),
    });
    // Without the finding: 3/100 ÷ (1/365) × 100 = 1,095 % on 2 Apr (84.102 annualizing formula).
    expect(alone.at(-1)?.percent).toBeCloseTo(1095, 9);
    const grouped = leakRateHistory({ fullChargeKg: lb(100), method: "annualizing", rules, additions: topUps });
    // One group: (3 + 3)/100 ÷ (60/365) × 100 = 36.5 %, days from 1 Feb (the last addition before it) to 2 Apr.
    expect(grouped).toHaveLength(2);
    expect(grouped[1]).toMatchObject({
      date: "2026-04-02",
      clockFrom: "2026-04-01",
      days: 60,
      additionIds: ["b", "c"],
    });
    expect(grouped[1].percent).toBeCloseTo(36.5, 9);
  });

  it("the group's repair clock runs from its first addition", () => {
    const s = status({ additions: topUps }, "2026-04-03");
    // 36.5 % > 20 % [S:R4]: 1 Apr + 30 days = 1 May.
    expect(s.due.find((d) => d.kind === "repair")?.dueOn).toBe("2026-05-01");
    // The figure is dated 2 Apr, so the item says why the 30 days end on 1 May and not on 2 May.
    expect(s.due.find((d) => d.kind === "repair")?.what).toBe(
      "Repair: leak rate 36.5 % on 2 Apr 2026 is above 20 % (the deadline runs from the first addition for this leak, on 1 Apr 2026)",
    );
  });

  it("an addition after the leak's repair starts a new group", () => {
    const groups = groupAdditions([...topUps, add("d", "2026-04-10", 2, "F")], [{ findingId: "F", on: "2026-04-05" }]);
    expect(groups.map((g) => g.items.map((a) => a.id))).toEqual([["a"], ["b", "c"], ["d"]]);
    // An addition on the repair day still belongs to the leak it repaired.
    const sameDay = groupAdditions([...topUps, add("d", "2026-04-05", 2, "F")], [{ findingId: "F", on: "2026-04-05" }]);
    expect(sameDay.map((g) => g.items.map((a) => a.id))).toEqual([["a"], ["b", "c", "d"]]);
    // 2 lb 8 days after the group's last addition: 2/100 ÷ (8/365) × 100 = 91.25 %.
    const after = leakRateHistory({
      fullChargeKg: lb(100),
      method: "annualizing",
      rules,
      additions: [...topUps, add("d", "2026-04-10", 2, "F")],
      findingRepairs: [{ findingId: "F", on: "2026-04-05" }],
    });
    expect(after.at(-1)).toMatchObject({ date: "2026-04-10", days: 8 });
    expect(after.at(-1)?.percent).toBeCloseTo(91.25, 9);
  });

  it("another leak topped up between a group's additions counts from the addition before it", () => {
    const points = leakRateHistory({
      fullChargeKg: lb(100),
      method: "annualizing",
      rules,
      additions: [
        add("a", "2026-02-01", 2),
        add("b", "2026-04-01", 3, "F"),
        add("x", "2026-04-03", 1, "G"),
        add("c", "2026-04-05", 3, "F"),
      ],
    });
    // F: 6 lb from 1 Feb to 5 Apr (63 days) = 6/100 × 365/63 = 34.76 %; G: 1 lb from 1 Apr (2 days) = 182.5 %.
    expect(points.map((p) => [p.date, p.days])).toEqual([
      ["2026-02-01", 365],
      ["2026-04-03", 2],
      ["2026-04-05", 63],
    ]);
    expect(points[2].percent).toBeCloseTo((6 / 100) * (365 / 63) * 100, 9);
  });
});
