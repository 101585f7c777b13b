import { yearOf, type IsoDate } from "../dates/calendar-date";
import { requirePositive } from "../input-error";
import { chronicReportDueDate } from "./deadlines";
import { validateAdditions, type ChargeAddition } from "./leak-rate";
import type { LeakRatePart } from "./rule-profile";

export interface ChronicLeakerYear {
  year: number;
  /** Added while a leak-repair part applied: what the year is judged by (0 in a year no part reached). */
  addedKg: number;
  /** `addedKg` as % of the full charge. */
  percent: number;
  chronic: boolean;
  /** The part whose chronic-leaker rule the year is judged by; null when no part applied in the year. */
  partId: string | null;
  /** Added while no part applied to the system: listed so the totals add up, never counted. */
  notCountedKg: number;
  /** The day of the year's last addition made while no part applied (why: the rule on that day). */
  lastNotCounted: IsoDate | null;
  /** The report's due date when chronic. */
  reportDue?: string;
}

/** The leak-repair part that applied to the system on a date, or null when none did. */
export type PartOn = (date: IsoDate) => LeakRatePart | null;

/**
 * Refrigerant added per calendar year (the store's calendar: dates are already local) and whether
 * it reaches the chronic-leaker share of the full charge (≥ 125 % [S:R7]). Voided and excluded
 * additions (retrofit, new installation, seasonal variance) do not count as loss.
 *
 * Only additions made while a part applied to the system count, and a year is judged by the part
 * of its last counted addition: a Part 84 system has no chronic-leaker year before 1 Jan 2026, and
 * Part 82 covers only ozone-depleting refrigerants since 2020 (docs/reference/standards.md §1
 * [S:R1,R2,R4]). A year with additions but no part is still listed, not judged (`partId` null), so
 * the yearly totals reconcile with the charge-added trail
 * (docs/decisions/0127-years-before-a-part-applied.md). Pass a part instead of `partOn` when one
 * part applied throughout.
 */
export function chronicLeakerYears(
  partOn: LeakRatePart | PartOn,
  fullChargeKg: number | ((date: IsoDate) => number),
  additions: readonly ChargeAddition[],
): ChronicLeakerYear[] {
  // The share is of the full charge in force on the year's last counted addition.
  if (typeof fullChargeKg === "number") requirePositive(fullChargeKg, "fullChargeKg");
  const chargeOn = typeof fullChargeKg === "function" ? fullChargeKg : () => fullChargeKg;
  validateAdditions(additions);
  const partAt: PartOn = typeof partOn === "function" ? partOn : () => partOn;
  type Year = {
    addedKg: number;
    part: LeakRatePart | null;
    lastDate: IsoDate | null;
    notCountedKg: number;
    lastNotCounted: IsoDate | null;
  };
  const byYear = new Map<number, Year>();
  for (const a of additions) {
    if (a.voided || a.excluded) continue;
    const year = yearOf(a.date);
    const y = byYear.get(year) ?? { addedKg: 0, part: null, lastDate: null, notCountedKg: 0, lastNotCounted: null };
    const part = partAt(a.date);
    if (!part) {
      y.notCountedKg += a.amountKg;
      if (!y.lastNotCounted || a.date >= y.lastNotCounted) y.lastNotCounted = a.date;
    } else {
      y.addedKg += a.amountKg;
      if (!y.lastDate || a.date >= y.lastDate) {
        y.part = part;
        y.lastDate = a.date;
      }
    }
    byYear.set(year, y);
  }
  return [...byYear.entries()]
    .sort(([a], [b]) => a - b)
    .map(([year, { addedKg, part, lastDate, notCountedKg, lastNotCounted }]) => {
      const listed = { year, notCountedKg, lastNotCounted };
      if (!part || !lastDate) return { ...listed, addedKg: 0, percent: 0, chronic: false, partId: null };
      const percent = (addedKg / requirePositive(chargeOn(lastDate), "fullChargeKg")) * 100;
      // Tolerance of 1e-9 so 125 % typed in lb and stored in kg still "reaches" 125 %.
      const chronic = percent >= part.chronicLeaker.percentOfFullCharge.value * (1 - 1e-9);
      const base = { ...listed, addedKg, percent, chronic, partId: part.id };
      return chronic ? { ...base, reportDue: chronicReportDueDate(part, year) } : base;
    });
}
