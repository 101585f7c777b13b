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
  /** The rule the threshold comes from, for the part in force on this date (a tag-bearing source). */
  thresholdSource: string | null;
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
  system: SystemForLeakRate | ((date: IsoDate) => SystemForLeakRate),
  additions: readonly ChargeAddition[],
  method: LeakRateMethod,
  followUpVerifiedOn: readonly IsoDate[] = [],
  findingRepairs: readonly FindingRepair[] = [],
  /** The day a retrofit started this regime; from then the part's own start date no longer matters. */
  regimeFrom: IsoDate | null = null,
): AssessedPoint[] {
  // Every figure reads the system's values in force on its own date (docs/decisions/0043-system-revisions.md).
  const on = typeof system === "function" ? system : () => system;
  // The formula's parameters (365-day cap, window, first-calculation days and date) come from the part in
  // force at the latest addition, else the profile's first part; a profile without leak-rate rules
  // (EU F-gas) has no leak-rate figures at all.
  validateAdditions(additions);
  const live = additions
    .filter((a) => !a.voided)
    .map((a) => a.date)
    .sort();
  const latest = live.at(-1);
  const inForce = latest
    ? applicableLeakRatePart(profile, on(latest).refrigerant, on(latest).fullChargeKg, latest)
    : undefined;
  const part = inForce?.part ?? profile.leakRateParts[0];
  if (!part || !latest) return [];
  const rules = {
    maxDaysSinceLastAddition: part.maxDaysSinceLastAddition.value,
    firstCalculationDays: part.firstCalculationDays.value,
    rollingWindowDays: part.rollingWindowDays.value,
    // A regime that a retrofit started after the part took effect has its own start: the retrofit
    // fill restarts the clock like any addition (docs/decisions/0043-system-revisions.md).
    firstCalculationFrom:
      part.effectiveFrom && !(regimeFrom && regimeFrom >= part.effectiveFrom.value)
        ? part.effectiveFrom.value
        : undefined,
  };
  const history = leakRateHistory({
    fullChargeKg: on(latest).fullChargeKg,
    fullChargeKgOn: (d) => on(d).fullChargeKg,
    additions,
    method,
    rules,
    followUpVerifiedOn,
    findingRepairs,
  });
  return history.map((point) => {
    const facts = on(point.date);
    const a = applicableLeakRatePart(profile, facts.refrigerant, facts.fullChargeKg, point.date);
    if (!a.applies) return { ...point, partId: null, thresholdPercent: null, thresholdSource: null, exceeds: false };
    const { percent: threshold, source: thresholdSource } = leakRateThreshold(a.part, facts.applianceType);
    const exceeds = exceedsThreshold(point.percent, threshold);
    return exceeds
      ? {
          ...point,
          partId: a.part.id,
          thresholdPercent: threshold,
          thresholdSource,
          exceeds,
          repairDue: repairDueDate(a.part, point.clockFrom),
        }
      : { ...point, partId: a.part.id, thresholdPercent: threshold, thresholdSource, exceeds };
  });
}
