import { describe, expect, it } from "vitest";
import { poundsToKg } from "../units/mass";
import { nextInspectionDate } from "./leak-check-interval";
import { automaticLeakDetectionRequired, inspectionsAfterBreach } from "./inspections-after-breach";
import { PART_82_SUBPART_F, PART_84_SUBPART_C } from "./us-federal-profile";

describe("US inspections after a breach (docs/reference/standards.md §1, from memory)", () => {
  it("is quarterly for commercial and IPR systems from 500 lb, yearly otherwise", () => {
    const big = inspectionsAfterBreach(PART_84_SUBPART_C, {
      applianceType: "commercial-refrigeration",
      fullChargeKg: poundsToKg(500),
      hasAutomaticLeakDetection: false,
    });
    expect(big.required && [big.everyMonths, big.untilPeriodsBelow]).toEqual([3, 4]);
    const smaller = inspectionsAfterBreach(PART_84_SUBPART_C, {
      applianceType: "commercial-refrigeration",
      fullChargeKg: poundsToKg(499),
      hasAutomaticLeakDetection: false,
    });
    expect(smaller.required && [smaller.everyMonths, smaller.untilPeriodsBelow]).toEqual([12, 1]);
    const comfort = inspectionsAfterBreach(PART_82_SUBPART_F, {
      applianceType: "comfort-cooling",
      fullChargeKg: poundsToKg(800),
      hasAutomaticLeakDetection: false,
    });
    expect(comfort.required && comfort.everyMonths).toBe(12);
    expect(
      inspectionsAfterBreach(PART_84_SUBPART_C, {
        applianceType: "industrial-process",
        fullChargeKg: poundsToKg(900),
        hasAutomaticLeakDetection: true,
      }).required,
    ).toBe(false);
    // Quarterly from a 30 Nov inspection: 28 Feb (month-end clamp, common practice).
    expect(nextInspectionDate("2026-11-30", big.required ? big.everyMonths : 0)).toBe("2027-02-28");
  });
  it("requires automatic leak detection for CR and IPR from 1,500 lb under Part 84", () => {
    // [S:R4]: ALD required for CR and IPR ≥ 1,500 lb.
    expect(
      automaticLeakDetectionRequired(PART_84_SUBPART_C, {
        applianceType: "commercial-refrigeration",
        fullChargeKg: poundsToKg(1500),
      }),
    ).toBe(true);
    expect(
      automaticLeakDetectionRequired(PART_84_SUBPART_C, {
        applianceType: "commercial-refrigeration",
        fullChargeKg: poundsToKg(1499),
      }),
    ).toBe(false);
    expect(
      automaticLeakDetectionRequired(PART_84_SUBPART_C, {
        applianceType: "comfort-cooling",
        fullChargeKg: poundsToKg(5000),
      }),
    ).toBe(false);
    expect(
      automaticLeakDetectionRequired(PART_82_SUBPART_F, {
        applianceType: "commercial-refrigeration",
        fullChargeKg: poundsToKg(5000),
      }),
    ).toBe(false); // optional under Part 82 [M]
  });
});
