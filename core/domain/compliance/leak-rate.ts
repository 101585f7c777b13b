import { addDays, compareDates, daysBetween, parseIsoDate, type IsoDate } from "../dates/calendar-date";
import { DomainInputError, requirePositive } from "../input-error";
import type { LeakRateMethod } from "./rule-profile";

/**
 * Leak-rate figures of 40 CFR 82.152 / 84.102 (docs/reference/standards.md §1). The part-specific numbers
 * (365-day cap, window, first-calculation days) come in through `LeakRateRules`, read from the
 * rule profile, so nothing regulatory is fixed here.
 */

/** A charge-added record. Dates are calendar dates in the store's time zone. */
export interface ChargeAddition {
  id: string;
  date: IsoDate;
  amountKg: number;
  /** Voided by a correcting entry: ignored everywhere (it stays in the audit trail, not in the figures). */
  voided?: boolean;
  /** No leak-rate calculation at this addition (40 CFR 82.157: after a retrofit, new install or seasonal variance [S:R1]). */
  excluded?: "retrofit" | "new-installation" | "seasonal-variance";
}

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
  /** The calculation date (the addition's date). */
  date: IsoDate;
  method: LeakRateMethod;
  /** % of full charge per year, unrounded. */
  percent: number;
  /** Refrigerant counted in this figure. */
  countedKg: number;
  /** The additions of this date that triggered the calculation. */
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

/** Groups same-day additions: topping up in several steps on one visit is one event (from memory: "count together"). */
function byDate(additions: ChargeAddition[]): { date: IsoDate; items: ChargeAddition[] }[] {
  const groups: { date: IsoDate; items: ChargeAddition[] }[] = [];
  for (const a of additions) {
    const last = groups.at(-1);
    if (last && last.date === a.date) last.items.push(a);
    else groups.push({ date: a.date, items: [a] });
  }
  return groups;
}

export interface LeakRateInput {
  fullChargeKg: number;
  additions: readonly ChargeAddition[];
  method: LeakRateMethod;
  rules: LeakRateRules;
  /** Dates of successful follow-up verification tests (rolling average shortens its window to after the last one). */
  followUpVerifiedOn?: readonly IsoDate[];
}

/**
 * The leak rate at every addition, oldest first. Voided entries are ignored; excluded ones
 * (retrofit, new installation, seasonal variance) get no figure and are not counted as loss, but
 * still restart the annualizing clock, because refrigerant was added that day. That last point is
 * our reading; no published text on it was found.
 */
export function leakRateHistory(input: LeakRateInput): LeakRatePoint[] {
  const { fullChargeKg, method, rules } = input;
  requirePositive(fullChargeKg, "fullChargeKg");
  const groups = byDate(liveSorted(input.additions));
  const verified = (input.followUpVerifiedOn ?? [])
    .map((d, i) => (parseIsoDate(d, `followUpVerifiedOn[${i}]`), d))
    .sort(compareDates);
  const points: LeakRatePoint[] = [];
  if (rules.firstCalculationFrom) parseIsoDate(rules.firstCalculationFrom, "rules.firstCalculationFrom");
  const startsRegime = (date: IsoDate) =>
    rules.firstCalculationFrom !== undefined &&
    compareDates(date, rules.firstCalculationFrom) >= 0 &&
    !points.some((p) => compareDates(p.date, rules.firstCalculationFrom!) >= 0);
  groups.forEach((group, i) => {
    const counted = group.items.filter((a) => !a.excluded);
    if (counted.length === 0) return;
    const addedKg = counted.reduce((s, a) => s + a.amountKg, 0);
    const additionIds = counted.map((a) => a.id);
    if (method === "annualizing") {
      const previous = groups[i - 1];
      const days =
        previous && !startsRegime(group.date)
          ? Math.min(daysBetween(previous.date, group.date), rules.maxDaysSinceLastAddition)
          : rules.firstCalculationDays;
      points.push({
        date: group.date,
        method,
        percent: annualizedLeakRate(addedKg, fullChargeKg, days),
        countedKg: addedKg,
        additionIds,
        days,
      });
      return;
    }
    // The window is the `rollingWindowDays` calendar days ending on the calculation date, or starts
    // the day after the last follow-up verification before that date if that is later.
    let windowStart = addDays(group.date, 1 - rules.rollingWindowDays);
    const lastVerified = verified.filter((d) => compareDates(d, group.date) < 0).at(-1);
    if (lastVerified && compareDates(addDays(lastVerified, 1), windowStart) > 0) windowStart = addDays(lastVerified, 1);
    const inWindow = groups
      .filter((g) => compareDates(g.date, windowStart) >= 0 && compareDates(g.date, group.date) <= 0)
      .flatMap((g) => g.items.filter((a) => !a.excluded));
    const windowKg = inWindow.reduce((s, a) => s + a.amountKg, 0);
    points.push({
      date: group.date,
      method,
      percent: rollingAverageLeakRate(windowKg, fullChargeKg),
      countedKg: windowKg,
      additionIds,
      days: daysBetween(windowStart, group.date) + 1,
      windowStart,
    });
  });
  return points;
}
