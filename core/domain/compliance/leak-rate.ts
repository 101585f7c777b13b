import { addDays, compareDates, daysBetween, parseIsoDate, type IsoDate } from "../dates/calendar-date";
import { DomainInputError, requirePositive } from "../input-error";
import type { ChargeAddition } from "./charge-addition";
import { groupAdditions, lastAdditionBefore, type FindingRepair } from "./leak-groups";
import type { LeakRateMethod } from "./rule-profile";

/**
 * Leak-rate figures of 40 CFR 82.152 / 84.102 (docs/reference/standards.md §1). The part-specific numbers
 * (365-day cap, window, first-calculation days) come in through `LeakRateRules`, read from the
 * rule profile, so nothing regulatory is fixed here.
 */

export type { ChargeAddition } from "./charge-addition";

export interface LeakRateRules {
  maxDaysSinceLastAddition: number;
  /** Days used by the annualizing method for the first calculation (no earlier addition). */
  firstCalculationDays: number;
  rollingWindowDays: number;
  /**
   * When a regime starts on a date (Part 84: 1 Jan 2026), the first calculation on or after it
   * also counts as a first calculation, whatever was added before (docs/reference/standards.md §1 [M]).
   */
  firstCalculationFrom?: IsoDate;
}

export interface LeakRatePoint {
  /** The calculation date: the last addition of its group. */
  date: IsoDate;
  /** The group's first addition: the repair clock runs from this day. */
  clockFrom: IsoDate;
  method: LeakRateMethod;
  /** % of full charge per year, unrounded. */
  percent: number;
  /** Refrigerant counted in this figure. */
  countedKg: number;
  /** The additions counted in this figure (one leak's top-ups before its repair, or one day's). */
  additionIds: string[];
  /** Annualizing: the days used (capped). Rolling average: the window length in days. */
  days: number;
  /** Rolling average: first day of the window. */
  windowStart?: IsoDate;
}

/**
 * Annualizing method: `LR% = (added / full charge) ÷ (days / 365) × 100`, where the caller has
 * already taken the shorter of the days since the last addition and 365. The 365 in the
 * denominator is the year the rate is expressed per, not a rule parameter.
 */
export function annualizedLeakRate(addedKg: number, fullChargeKg: number, days: number): number {
  requirePositive(fullChargeKg, "fullChargeKg");
  if (!(addedKg >= 0)) throw new DomainInputError("addedKg", `must be ≥ 0, got ${addedKg}`);
  if (!Number.isInteger(days) || days < 1)
    throw new DomainInputError("days", `must be a whole number of days ≥ 1, got ${days}`);
  return (addedKg / fullChargeKg / (days / 365)) * 100;
}

/** Rolling-average method: `LR% = added within the window / full charge × 100`. */
export function rollingAverageLeakRate(addedInWindowKg: number, fullChargeKg: number): number {
  requirePositive(fullChargeKg, "fullChargeKg");
  if (!(addedInWindowKg >= 0)) throw new DomainInputError("addedInWindowKg", `must be ≥ 0, got ${addedInWindowKg}`);
  return (addedInWindowKg / fullChargeKg) * 100;
}

/** Checks every addition's date and amount, naming the offending entry. */
export function validateAdditions(additions: readonly ChargeAddition[]): void {
  additions.forEach((a, i) => {
    parseIsoDate(a.date, `additions[${i}].date`);
    if (!(typeof a.amountKg === "number" && Number.isFinite(a.amountKg) && a.amountKg > 0)) {
      throw new DomainInputError(
        `additions[${i}].amountKg`,
        `must be a positive number of kg, got ${String(a.amountKg)}`,
      );
    }
  });
}

function liveSorted(additions: readonly ChargeAddition[]): ChargeAddition[] {
  validateAdditions(additions);
  return additions
    .filter((a) => !a.voided)
    .slice()
    .sort((a, b) => compareDates(a.date, b.date));
}

export interface LeakRateInput {
  fullChargeKg: number;
  /** The full charge in force on a calculation date, when it changed over time (else `fullChargeKg`). */
  fullChargeKgOn?: (date: IsoDate) => number;
  additions: readonly ChargeAddition[];
  method: LeakRateMethod;
  rules: LeakRateRules;
  /** Dates of successful follow-up verification tests (rolling average shortens its window to after the last one). */
  followUpVerifiedOn?: readonly IsoDate[];
  /** Repairs per finding: a leak's additions before its repair form one group. */
  findingRepairs?: readonly FindingRepair[];
}

/**
 * The leak rate at every group of additions (docs/reference/standards.md §1), ordered by
 * calculation date. Voided entries are ignored; excluded ones (retrofit, new installation,
 * seasonal variance) get no figure and are not counted as loss, but still restart the annualizing
 * clock, because refrigerant was added that day (our reading; no published text on it was found).
 * A group's annualizing figure counts the days from the last addition before the group to the
 * group's last addition (docs/decisions/0042-same-leak-additions.md).
 */
export function leakRateHistory(input: LeakRateInput): LeakRatePoint[] {
  const { method, rules } = input;
  requirePositive(input.fullChargeKg, "fullChargeKg");
  const chargeOn = input.fullChargeKgOn ?? (() => input.fullChargeKg);
  const live = liveSorted(input.additions);
  const groups = groupAdditions(live, input.findingRepairs ?? []);
  const verified = (input.followUpVerifiedOn ?? [])
    .map((d, i) => (parseIsoDate(d, `followUpVerifiedOn[${i}]`), d))
    .sort(compareDates);
  if (rules.firstCalculationFrom) parseIsoDate(rules.firstCalculationFrom, "rules.firstCalculationFrom");
  const from = rules.firstCalculationFrom;
  // The first figure on or after a regime's start date is a first calculation, whatever came before.
  const firstInRegime =
    from === undefined
      ? undefined
      : groups
          .filter((g) => g.items.some((a) => !a.excluded) && compareDates(g.lastDate, from) >= 0)
          .sort((x, y) => compareDates(x.lastDate, y.lastDate))[0];
  const points: LeakRatePoint[] = [];
  for (const group of groups) {
    const counted = group.items.filter((a) => !a.excluded);
    if (counted.length === 0) continue;
    const addedKg = counted.reduce((s, a) => s + a.amountKg, 0);
    const fullChargeKg = chargeOn(group.lastDate);
    const base = { date: group.lastDate, clockFrom: group.firstDate, method, additionIds: counted.map((a) => a.id) };
    if (method === "annualizing") {
      const previous = lastAdditionBefore(live, group, group.firstDate);
      const days =
        previous && group !== firstInRegime
          ? Math.max(1, Math.min(daysBetween(previous, group.lastDate), rules.maxDaysSinceLastAddition))
          : rules.firstCalculationDays;
      points.push({ ...base, percent: annualizedLeakRate(addedKg, fullChargeKg, days), countedKg: addedKg, days });
      continue;
    }
    // The window is the `rollingWindowDays` calendar days ending on the calculation date, or starts
    // the day after the last follow-up verification before that date if that is later.
    let windowStart = addDays(group.lastDate, 1 - rules.rollingWindowDays);
    const lastVerified = verified.filter((d) => compareDates(d, group.lastDate) < 0).at(-1);
    if (lastVerified && compareDates(addDays(lastVerified, 1), windowStart) > 0) windowStart = addDays(lastVerified, 1);
    const windowKg = live
      .filter((a) => !a.excluded && compareDates(a.date, windowStart) >= 0 && compareDates(a.date, group.lastDate) <= 0)
      .reduce((s, a) => s + a.amountKg, 0);
    points.push({
      ...base,
      percent: rollingAverageLeakRate(windowKg, fullChargeKg),
      countedKg: windowKg,
      days: daysBetween(windowStart, group.lastDate) + 1,
      windowStart,
    });
  }
  return points.sort((x, y) => compareDates(x.date, y.date) || compareDates(x.clockFrom, y.clockFrom));
}
