import { requirePositive } from "../input-error";
import { massLimitKg } from "./applicability";
import type { ApplianceType, LeakRatePart } from "./rule-profile";

export type InspectionPlan =
  | { required: true; everyMonths: number; untilPeriodsBelow: number; reason: string }
  | { required: false; reason: string };

/** "≥ limit" with the same 1e-9 relative tolerance as applicability (lb typed, kg stored). */
const atLeast = (kg: number, limitKg: number) => kg >= limitKg * (1 - 1e-9);

/**
 * US periodic leak inspections after a leak-rate breach (docs/reference/standards.md §1, from memory): large
 * commercial and IPR systems quarterly until four quarters below the threshold, the rest yearly
 * until a year below, none while a yearly-calibrated automatic leak detection system watches.
 * The next date is `nextInspectionDate(lastInspection, everyMonths)`.
 */
export function inspectionsAfterBreach(
  part: LeakRatePart,
  system: { applianceType: ApplianceType; fullChargeKg: number; hasAutomaticLeakDetection: boolean },
): InspectionPlan {
  requirePositive(system.fullChargeKg, "fullChargeKg");
  const rule = part.inspectionsAfterBreach?.value;
  if (!rule) return { required: false, reason: `${part.title} sets no inspections after a breach in this profile` };
  if (system.hasAutomaticLeakDetection && rule.waivedWithAutomaticLeakDetection) {
    return { required: false, reason: "waived while automatic leak detection, calibrated yearly, watches the system" };
  }
  const large =
    rule.largeTypes.includes(system.applianceType) && atLeast(system.fullChargeKg, massLimitKg(rule.largeFromCharge));
  return large
    ? {
        required: true,
        everyMonths: rule.largeEveryMonths,
        untilPeriodsBelow: rule.largeUntilPeriodsBelow,
        reason: `${rule.largeFromCharge.value} ${rule.largeFromCharge.unit} or more: every ${rule.largeEveryMonths} months until ${rule.largeUntilPeriodsBelow} periods below the threshold`,
      }
    : {
        required: true,
        everyMonths: rule.otherEveryMonths,
        untilPeriodsBelow: rule.otherUntilPeriodsBelow,
        reason: `every ${rule.otherEveryMonths} months until ${rule.otherUntilPeriodsBelow} period below the threshold`,
      };
}

/** Whether the part requires automatic leak detection for this system (Part 84: CR and IPR ≥ 1,500 lb [S:R4]). */
export function automaticLeakDetectionRequired(
  part: LeakRatePart,
  system: { applianceType: ApplianceType; fullChargeKg: number },
): boolean {
  requirePositive(system.fullChargeKg, "fullChargeKg");
  const rule = part.automaticLeakDetectionRequired?.value;
  return (
    !!rule && rule.types.includes(system.applianceType) && atLeast(system.fullChargeKg, massLimitKg(rule.fromCharge))
  );
}
