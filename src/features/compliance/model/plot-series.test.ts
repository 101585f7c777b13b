import { describe, expect, it } from "vitest";
import type { SystemRecordsView } from "#core/contracts/compliance";
import { chargeSeries, dayLabel, dayValue, leakCheckSeries, leakRateSeries, timeDomain } from "./plot-series";

const addition = (id: string, addedOn: string, amountKg: number, voided = false) => ({
  id,
  systemId: "00000000-0000-4000-8000-000000000000",
  addedOn,
  amountKg,
  enteredValue: amountKg,
  enteredUnit: "kg" as const,
  technician: "Ines",
  reason: "Top-up",
  excluded: null,
  findingId: null,
  correctsId: null,
  recordedBy: "Ines",
  recordedAt: `${addedOn}T12:00:00Z`,
  voided: voided ? { at: `${addedOn}T13:00:00Z`, by: "Ines", reason: "Duplicate", byEntryId: null } : null,
});

const records = {
  additions: [
    addition("a", "2026-03-01", 4.5359237),
    addition("b", "2026-03-01", 0.45359237),
    addition("c", "2026-05-10", 2, true),
    addition("d", "2026-01-15", 0.90718474),
  ],
  leakRates: [
    {
      date: "2026-03-01",
      method: "annualizing",
      percent: 44.1,
      countedKg: 5,
      days: 45,
      windowStart: null,
      additionIds: ["a", "b"],
      partId: "p84",
      thresholdPercent: 20,
      exceeds: true,
      repairDue: "2026-03-31",
    },
    {
      date: "2026-01-15",
      method: "annualizing",
      percent: 2,
      countedKg: 1,
      days: 365,
      windowStart: null,
      additionIds: ["d"],
      partId: "p84",
      thresholdPercent: 20,
      exceeds: false,
      repairDue: null,
    },
  ],
  leakChecks: [
    { id: "x", checkedOn: "2026-06-01", leakFound: false, note: "", by: "Ines" },
    { id: "y", checkedOn: "2026-02-01", leakFound: true, note: "", by: "Ines" },
  ],
} as unknown as SystemRecordsView;

describe("plot series", () => {
  it("puts the leak rates in date order with the threshold in force", () => {
    expect(leakRateSeries(records).map((p) => [p.day, p.percent, p.threshold, p.exceeds])).toEqual([
      ["2026-01-15", 2, 20, false],
      ["2026-03-01", 44.1, 20, true],
    ]);
  });

  it("sums a day's additions in the reader's unit, leaves voided ones out, and keeps a running total", () => {
    // 1 lb = 0.45359237 kg exactly (NIST SP 811, appendix B.8): 4.5359237 kg is 10 lb.
    const lb = chargeSeries(records, "lb");
    expect(lb.map((p) => p.day)).toEqual(["2026-01-15", "2026-03-01"]);
    expect(lb[0].added).toBeCloseTo(2, 9);
    expect(lb[1].added).toBeCloseTo(11, 9);
    expect(lb[1].total).toBeCloseTo(13, 9);
    expect(chargeSeries(records, "kg")[1].added).toBeCloseTo(4.98951607, 8);
  });

  it("orders leak checks, and reads days as UTC midnights", () => {
    expect(leakCheckSeries(records).map((c) => [c.day, c.leakFound])).toEqual([
      ["2026-02-01", true],
      ["2026-06-01", false],
    ]);
    expect(dayLabel(dayValue("2026-02-28"))).toBe("28 Feb 2026");
    const [lo, hi] = timeDomain([dayValue("2026-01-01")]);
    expect(hi - lo).toBe(14 * 86_400_000);
  });
});
