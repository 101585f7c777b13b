import type { IsoDate } from "../dates/calendar-date";
import type { Refrigerant } from "../refrigerants/types";
import { applicableLeakRatePart, exceedsThreshold, leakRateThreshold } from "./applicability";
import { repairDueDate } from "./deadlines";
import type { FindingRepair } from "./leak-groups";
import { leakRateHistory, validateAdditions, type ChargeAddition, type LeakRatePoint } from "./leak-rate";
import type { ApplianceType, LeakRateMethod, RuleProfile } from "./rule-profile";

export interface SystemForLeakRate {
  refrigerant: Refrigerant;
  fullChargeKg: number;
  applianceType: ApplianceType;
}

export interface AssessedPoint extends LeakRatePoint {
  /** The part in force on this date, or null when none applies (then there is no threshold). */
  partId: string | null;
  thresholdPercent: number | null;
  exceeds: boolean;
  /**
   * When the rate exceeds the threshold: repair due, counted from the group's first addition. The
   * system status replaces it with its breach episode's deadline (docs/decisions/0041-repair-clock.md).
   */
  repairDue?: IsoDate;
}

/**
 * Leak rate at every addition with the threshold for the appliance type and breaches marked.
 * Applicability is judged on each calculation's date, so a Part 84 system gets thresholds only
 * from the part's effective date.
 */
export function assessLeakRate(
  profile: RuleProfile,
  system: SystemForLeakRate,
  additions: readonly ChargeAddition[],
  method: LeakRateMethod,
  followUpVerifiedOn: readonly IsoDate[] = [],
  findingRepairs: readonly FindingRepair[] = [],
): AssessedPoint[] {
  // The formula's parameters (365-day cap, window, first-calculation days and date) come from the part in
  // force at the latest addition, else the profile's first part; a profile without leak-rate rules
  // (EU F-gas) has no leak-rate figures at all.
  validateAdditions(additions);
  const live = additions
    .filter((a) => !a.voided)
    .map((a) => a.date)
    .sort();
  const latest = live.at(-1);
  const inForce = latest ? applicableLeakRatePart(profile, system.refrigerant, system.fullChargeKg, latest) : undefined;
  const part = inForce?.part ?? profile.leakRateParts[0];
  if (!part) return [];
  const rules = {
    maxDaysSinceLastAddition: part.maxDaysSinceLastAddition.value,
    firstCalculationDays: part.firstCalculationDays.value,
    rollingWindowDays: part.rollingWindowDays.value,
    firstCalculationFrom: part.effectiveFrom?.value,
  };
  const history = leakRateHistory({
    fullChargeKg: system.fullChargeKg,
    additions,
    method,
    rules,
    followUpVerifiedOn,
    findingRepairs,
  });
  return history.map((point) => {
    const a = applicableLeakRatePart(profile, system.refrigerant, system.fullChargeKg, point.date);
    if (!a.applies) return { ...point, partId: null, thresholdPercent: null, exceeds: false };
    const threshold = leakRateThreshold(a.part, system.applianceType).percent;
    const exceeds = exceedsThreshold(point.percent, threshold);
    return exceeds
      ? {
          ...point,
          partId: a.part.id,
          thresholdPercent: threshold,
          exceeds,
          repairDue: repairDueDate(a.part, point.clockFrom),
        }
      : { ...point, partId: a.part.id, thresholdPercent: threshold, exceeds };
  });
}
