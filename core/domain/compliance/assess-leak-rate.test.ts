import { describe, expect, it } from "vitest";
import { roundHalfUp } from "../numbers/round-half-up";
import { getRefrigerant } from "../refrigerants/catalogue";
import { poundsToKg } from "../units/mass";
import { assessLeakRate, type SystemForLeakRate } from "./assess-leak-rate";
import { EU_FGAS_PROFILE } from "./eu-fgas-profile";
import type { ChargeAddition } from "./leak-rate";
import { US_FEDERAL_PROFILE } from "./us-federal-profile";

const lb = (id: string, date: string, pounds: number): ChargeAddition => ({ id, date, amountKg: poundsToKg(pounds) });
const rack = (
  id: string,
  fullLb: number,
  applianceType: SystemForLeakRate["applianceType"] = "commercial-refrigeration",
): SystemForLeakRate => ({
  refrigerant: getRefrigerant(id),
  fullChargeKg: poundsToKg(fullLb),
  applianceType,
});

describe("assessLeakRate", () => {
  it("marks the 20.28 % addition on a commercial R-404A rack as a breach with its repair date", () => {
    // docs/reference/standards.md §1 [D]: 10 lb into 100 lb after 180 days = 20.28 % > 20 % commercial [S:R4];
    // repair within 30 days [S:R4]: learned 2026-07-31 + 30 days = 2026-08-30.
    const points = assessLeakRate(
      US_FEDERAL_PROFILE,
      rack("R-404A", 100),
      [lb("a", "2026-02-01", 2), lb("b", "2026-07-31", 10)],
      "annualizing",
    );
    expect(points[1].days).toBe(180);
    expect(roundHalfUp(points[1].percent, 2)).toBe(20.28);
    expect(points[1].partId).toBe("40-cfr-84-subpart-c");
    expect(points[1].thresholdPercent).toBe(20);
    expect(points[1].exceeds).toBe(true);
    expect(points[1].repairDue).toBe("2026-08-30");
    expect(points[0].exceeds).toBe(false);
  });
  it("applies the threshold of the appliance type", () => {
    // 15 %/yr: under 20 % commercial and 30 % IPR, over 10 % comfort cooling (40 CFR 84.106 [S:R4]).
    // 15 lb into 100 lb after 365 days = 15 %.
    const adds = [lb("a", "2026-01-01", 1), lb("b", "2027-01-01", 15)];
    expect(
      assessLeakRate(US_FEDERAL_PROFILE, rack("R-410A", 100, "commercial-refrigeration"), adds, "annualizing")[1]
        .exceeds,
    ).toBe(false);
    expect(
      assessLeakRate(US_FEDERAL_PROFILE, rack("R-410A", 100, "industrial-process"), adds, "annualizing")[1].exceeds,
    ).toBe(false);
    expect(
      assessLeakRate(US_FEDERAL_PROFILE, rack("R-410A", 100, "comfort-cooling"), adds, "annualizing")[1].exceeds,
    ).toBe(true);
  });
  it("has no threshold before Part 84 takes effect, and restarts its count on 1 Jan 2026", () => {
    // [S:R4]: Part 84 subpart C from 1 Jan 2026; its first calculation after that date uses 365 days [M].
    const adds = [
      lb("a", "2025-11-01", 5),
      lb("b", "2025-12-01", 5),
      lb("c", "2026-01-01", 5),
      lb("d", "2026-01-31", 5),
    ];
    const points = assessLeakRate(US_FEDERAL_PROFILE, rack("R-404A", 100), adds, "annualizing");
    expect(points.map((p) => p.partId)).toEqual([null, null, "40-cfr-84-subpart-c", "40-cfr-84-subpart-c"]);
    expect(roundHalfUp(points[1].percent, 1)).toBe(60.8); // 5 lb / 100 lb over 30 days, but no part in force yet
    expect(points[1].exceeds).toBe(false);
    expect(points[2].days).toBe(365);
    expect(points[2].exceeds).toBe(false); // 5 %
    expect(points[3].days).toBe(30);
    expect(points[3].exceeds).toBe(true); // 60.8 % > 20 %
    const small = assessLeakRate(
      US_FEDERAL_PROFILE,
      rack("R-404A", 14),
      [lb("a", "2026-03-01", 1), lb("b", "2026-03-31", 5)],
      "annualizing",
    );
    expect(small[1].thresholdPercent).toBeNull();
  });
  it("uses the rolling average when the company chose it", () => {
    // [S:R7] rolling average: 12 + 10 lb in the previous 365 days on 100 lb = 22 % > 20 %.
    const points = assessLeakRate(
      US_FEDERAL_PROFILE,
      rack("R-22", 100),
      [lb("a", "2026-03-01", 12), lb("b", "2026-09-01", 10)],
      "rolling-average",
    );
    expect(points.map((p) => roundHalfUp(p.percent, 6))).toEqual([12, 22]);
    expect(points[1].partId).toBe("40-cfr-82-subpart-f");
    expect(points[1].exceeds).toBe(true);
    expect(points[1].repairDue).toBe("2026-10-01");
  });
  it("gives no leak-rate figures under a profile without leak-rate rules", () => {
    expect(assessLeakRate(EU_FGAS_PROFILE, rack("R-404A", 100), [lb("a", "2026-03-01", 12)], "annualizing")).toEqual(
      [],
    );
  });
});
