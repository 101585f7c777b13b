import { describe, expect, it } from "vitest";
import { localDateOf } from "../dates/time-zone";
import { poundsToKg } from "../units/mass";
import { chronicLeakerYears } from "./chronic-leaker";
import type { ChargeAddition } from "./leak-rate";
import { PART_84_SUBPART_C } from "./us-federal-profile";

const lb = (id: string, date: string, pounds: number, extra: Partial<ChargeAddition> = {}): ChargeAddition => ({
  id,
  date,
  amountKg: poundsToKg(pounds),
  ...extra,
});

describe("chronic leaker (≥ 125 % of full charge added in a calendar year)", () => {
  // [S:R7]: 125 % of full charge in a calendar year → report by 1 March of the next year.
  it("does not add December and January together", () => {
    const years = chronicLeakerYears(PART_84_SUBPART_C, poundsToKg(100), [
      lb("a", "2026-12-15", 70),
      lb("b", "2027-01-05", 70),
    ]);
    expect(years.map((y) => [y.year, Math.round(y.percent), y.chronic])).toEqual([
      [2026, 70, false],
      [2027, 70, false],
    ]);
  });
  it("flags a year that reaches exactly 125 % and dates the report", () => {
    const years = chronicLeakerYears(PART_84_SUBPART_C, poundsToKg(100), [
      lb("a", "2027-01-05", 70),
      lb("b", "2027-06-01", 55),
      lb("v", "2027-07-01", 30, { voided: true }),
    ]);
    expect(years).toHaveLength(1);
    expect(years[0].percent).toBeCloseTo(125, 10);
    expect(years[0].chronic).toBe(true);
    expect(years[0].reportDue).toBe("2028-03-01");
    // In kg with exact binary values: 100 + 25 kg into 100 kg is exactly 125 %.
    const exact = chronicLeakerYears(PART_84_SUBPART_C, 100, [
      { id: "a", date: "2027-02-01", amountKg: 100 },
      { id: "b", date: "2027-03-01", amountKg: 25 },
    ]);
    expect(exact[0].percent).toBe(125);
    expect(exact[0].chronic).toBe(true);
    const below = chronicLeakerYears(PART_84_SUBPART_C, poundsToKg(100), [
      lb("a", "2027-01-05", 70),
      lb("b", "2027-06-01", 54.9),
    ]);
    expect(below[0].chronic).toBe(false);
  });
  it("files an addition by the store's calendar, not UTC", () => {
    // IANA tz: New York is UTC−5 on 1 Jan, so 03:00 UTC on 1 Jan 2027 is 22:00 on 31 Dec 2026 there.
    const date = localDateOf(new Date("2027-01-01T03:00:00Z"), "America/New_York");
    const years = chronicLeakerYears(PART_84_SUBPART_C, poundsToKg(100), [
      lb("a", "2026-03-01", 100),
      lb("b", date, 30),
    ]);
    expect(years).toHaveLength(1);
    expect(years[0].year).toBe(2026);
    expect(years[0].chronic).toBe(true);
    expect(years[0].reportDue).toBe("2027-03-01");
  });
});

describe("chronic-leaker years follow the part that applied in that year", () => {
  // docs/reference/standards.md §1: Part 84 from 1 Jan 2026 [S:R4]; Part 82 leak repair covers ODS only since
  // 10 Apr 2020 [S:R1,R2]; 125 % of the full charge in a calendar year, report by 1 March [S:R7].
  const partOn = (date: string) => (date >= "2026-01-01" ? PART_84_SUBPART_C : null);
  it("counts no HFC year before 2026, and lists it as not judged so the totals add up", () => {
    const years = chronicLeakerYears(partOn, poundsToKg(100), [
      lb("a", "2025-02-01", 70),
      lb("b", "2025-11-01", 60),
      lb("c", "2026-03-01", 80),
      lb("d", "2026-10-01", 50),
    ]);
    expect(years.map((y) => [y.year, Math.round(y.percent), y.chronic, y.reportDue, y.partId])).toEqual([
      // 130 lb added in 2025 would be 130 % under a part; no part applied, so the year is not judged.
      [2025, 0, false, undefined, null],
      [2026, 130, true, "2027-03-01", "40-cfr-84-subpart-c"],
    ]);
    expect(years[0].notCountedKg).toBeCloseTo(poundsToKg(130), 12);
    expect(years[0].lastNotCounted).toBe("2025-11-01");
    expect(years[1].notCountedKg).toBe(0);
  });
  it("counts only the additions made while a part applied", () => {
    // A system that reached 15 lb only from 1 Jul (here: a part from that day): 100 lb before, 30 lb after.
    const years = chronicLeakerYears((d) => (d >= "2026-07-01" ? PART_84_SUBPART_C : null), poundsToKg(20), [
      lb("a", "2026-03-01", 100),
      lb("b", "2026-08-01", 30),
    ]);
    expect(years.map((y) => [y.year, Math.round(y.percent), y.chronic])).toEqual([[2026, 150, true]]);
    // The 100 lb added before the part applied is listed with the year, not counted.
    expect(years[0].notCountedKg).toBeCloseTo(poundsToKg(100), 12);
  });
});
