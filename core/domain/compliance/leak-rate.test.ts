import { describe, expect, it } from "vitest";
import { roundHalfUp } from "../numbers/round-half-up";
import { poundsToKg } from "../units/mass";
import {
  annualizedLeakRate,
  leakRateHistory,
  rollingAverageLeakRate,
  type ChargeAddition,
  type LeakRateRules,
} from "./leak-rate";
import { PART_82_SUBPART_F } from "./us-federal-profile";

// Rules as the US profile holds them (365-day cap, 365 first-calculation days, 365-day window).
const rules: LeakRateRules = {
  maxDaysSinceLastAddition: PART_82_SUBPART_F.maxDaysSinceLastAddition.value,
  firstCalculationDays: PART_82_SUBPART_F.firstCalculationDays.value,
  rollingWindowDays: PART_82_SUBPART_F.rollingWindowDays.value,
};
const lb = (id: string, date: string, pounds: number, extra: Partial<ChargeAddition> = {}): ChargeAddition => ({
  id,
  date,
  amountKg: poundsToKg(pounds),
  ...extra,
});
const annual = (fullLb: number, additions: ChargeAddition[]) =>
  leakRateHistory({ fullChargeKg: poundsToKg(fullLb), additions, method: "annualizing", rules });
const rolling = (fullLb: number, additions: ChargeAddition[], followUpVerifiedOn: string[] = []) =>
  leakRateHistory({
    fullChargeKg: poundsToKg(fullLb),
    additions,
    method: "rolling-average",
    rules,
    followUpVerifiedOn,
  });

describe("annualizing method (40 CFR 82.152 / 84.102)", () => {
  it("gives 60.8 % for 5 lb lost from 100 lb in 30 days", () => {
    // docs/reference/standards.md §1: trade example ~60 %/yr [S:R6]; formula with 30 days gives 60.8 % [D]:
    // (5/100) ÷ (30/365) × 100 = 60.83.
    expect(roundHalfUp(annualizedLeakRate(5, 100, 30), 1)).toBe(60.8);
    const points = annual(100, [lb("a", "2026-03-01", 1), lb("b", "2026-03-31", 5)]);
    expect(points[1].days).toBe(30);
    expect(roundHalfUp(points[1].percent, 1)).toBe(60.8);
  });
  it("gives 20.28 % for 10 lb into 100 lb after 180 days", () => {
    // docs/reference/standards.md §1 [D]: (10/100) ÷ (180/365) × 100 = 20.277…
    const points = annual(100, [lb("a", "2026-01-01", 2), lb("b", "2026-06-30", 10)]);
    expect(points[1].days).toBe(180);
    expect(roundHalfUp(points[1].percent, 2)).toBe(20.28);
  });
  it("gives 48.7 % for 2 lb into 50 lb after 30 days", () => {
    // docs/reference/standards.md §1 [D]: (2/50) ÷ (30/365) × 100 = 48.67.
    expect(roundHalfUp(annualizedLeakRate(2, 50, 30), 1)).toBe(48.7);
    expect(roundHalfUp(annual(50, [lb("a", "2026-09-01", 1), lb("b", "2026-10-01", 2)])[1].percent, 1)).toBe(48.7);
  });
  it("computes a figure at each of several additions", () => {
    // Hand calculation from the 82.152 formula, 100 lb full charge:
    // 1st: no earlier addition → 365 days [M] → 3/100 = 3 %;
    // 2nd: 60 days later, 4 lb → 4/100 × 365/60 = 24.333 %;
    // 3rd: 416 days later, capped at 365 → 6/100 = 6 %.
    const points = annual(100, [lb("a", "2026-01-10", 3), lb("b", "2026-03-11", 4), lb("c", "2027-05-01", 6)]);
    expect(points.map((p) => p.days)).toEqual([365, 60, 365]);
    expect(points[0].percent).toBeCloseTo(3, 10);
    expect(points[1].percent).toBeCloseTo(24.3333333, 6);
    expect(points[2].percent).toBeCloseTo(6, 10);
  });
  it("uses the shorter of the days since the last addition and 365", () => {
    // 40 CFR 82.152 annualizing method, "shorter of … or 365 days" [S:R7]: 5 lb into 100 lb.
    const at = (days: number) => annualizedLeakRate(5, 100, Math.min(days, 365));
    const history = (second: string) => annual(100, [lb("a", "2026-01-01", 1), lb("b", second, 5)])[1];
    expect(history("2026-12-31").days).toBe(364);
    expect(history("2026-12-31").percent).toBeCloseTo(at(364), 12); // 5.0137 %
    expect(history("2027-01-01").days).toBe(365);
    expect(history("2027-02-05").days).toBe(365); // 400 days, capped
    expect(history("2027-02-05").percent).toBeCloseTo(5, 12);
  });
  it("counts same-day additions together and ignores voided ones", () => {
    // Additions for the same leak count together (docs/reference/standards.md §1 [M]): 1 + 2 lb after 30 days on
    // 100 lb → 3/100 × 365/30 = 36.5 %. The voided 50 lb entry neither counts nor restarts the clock.
    const points = annual(100, [
      lb("a", "2026-04-01", 1),
      lb("v", "2026-04-20", 50, { voided: true }),
      lb("b", "2026-05-01", 1),
      lb("c", "2026-05-01", 2),
    ]);
    expect(points).toHaveLength(2);
    expect(points[1].additionIds).toEqual(["b", "c"]);
    expect(points[1].percent).toBeCloseTo(36.5, 10);
  });
  it("skips the figure after a retrofit, new installation or seasonal variance", () => {
    // 40 CFR 82.157 [S:R1]: no calculation after a retrofit, new install or seasonal variance.
    const points = annual(100, [
      lb("a", "2026-01-01", 1),
      lb("s", "2026-02-01", 8, { excluded: "seasonal-variance" }),
      lb("b", "2026-03-03", 2),
    ]);
    expect(points.map((p) => p.additionIds)).toEqual([["a"], ["b"]]);
    expect(points[1].days).toBe(30); // our reading: the excluded addition restarts the clock
  });
  it("treats the first calculation on or after a regime's start date as a first calculation", () => {
    // docs/reference/standards.md §1 [M]: the first Part 84 calculation after 1 Jan 2026 uses 365 days.
    const withStart = { ...rules, firstCalculationFrom: "2026-01-01" };
    const points = leakRateHistory({
      fullChargeKg: 100,
      method: "annualizing",
      rules: withStart,
      additions: [
        { id: "a", date: "2025-12-01", amountKg: 1 },
        { id: "b", date: "2026-01-10", amountKg: 4 },
        { id: "c", date: "2026-02-09", amountKg: 2 },
      ],
    });
    expect(points.map((p) => p.days)).toEqual([365, 365, 30]);
    expect(points[1].percent).toBeCloseTo(4, 12);
  });
  it("refuses bad additions by entry", () => {
    expect(() => annual(100, [lb("a", "2026-02-30", 1)])).toThrow(/^additions\[0\].date: 2026-02-30 does not exist/);
    expect(() => annual(100, [{ id: "a", date: "2026-01-01", amountKg: -1 }])).toThrow(/^additions\[0\].amountKg/);
    expect(() => leakRateHistory({ fullChargeKg: 0, additions: [], method: "annualizing", rules })).toThrow(
      /^fullChargeKg/,
    );
  });
});

describe("rolling-average method (40 CFR 82.152 / 84.102)", () => {
  // Hand calculations from the definition: lb added in the previous 365 days (the calculation day
  // and the 364 before it) / full charge × 100 [S:R7]; or since the last successful follow-up
  // verification if that is shorter [M].
  const adds = [
    lb("a", "2026-02-01", 5),
    lb("b", "2026-06-01", 10),
    lb("c", "2027-01-31", 3),
    lb("d", "2027-02-01", 2),
  ];
  it("sums the additions of the previous 365 days", () => {
    const points = rolling(100, adds);
    expect(points.map((p) => p.windowStart)).toEqual(["2025-02-02", "2025-06-02", "2026-02-01", "2026-02-02"]);
    expect(points.map((p) => roundHalfUp(p.percent, 6))).toEqual([5, 15, 18, 15]);
    expect(rollingAverageLeakRate(18, 100)).toBe(18);
  });
  it("starts after the last successful follow-up verification when that is shorter", () => {
    const points = rolling(100, adds, ["2026-07-01"]);
    expect(points[2].windowStart).toBe("2026-07-02");
    expect(roundHalfUp(points[2].percent, 6)).toBe(3);
    expect(roundHalfUp(points[3].percent, 6)).toBe(5);
    expect(roundHalfUp(points[1].percent, 6)).toBe(15); // the verification is later than this figure
  });
});
