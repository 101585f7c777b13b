import { yearOf, type IsoDate } from "../dates/calendar-date";
import { requirePositive } from "../input-error";
import { chronicReportDueDate } from "./deadlines";
import { validateAdditions, type ChargeAddition } from "./leak-rate";
import type { LeakRatePart } from "./rule-profile";

export interface ChronicLeakerYear {
  year: number;
  addedKg: number;
  /** Added as % of full charge. */
  percent: number;
  chronic: boolean;
  /** The part whose chronic-leaker rule the year is judged by. */
  partId: string;
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
 * [S:R1,R2,R4]). Pass a part instead of `partOn` when one part applied throughout.
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
  const byYear = new Map<number, { addedKg: number; part: LeakRatePart; lastDate: IsoDate }>();
  for (const a of additions) {
    if (a.voided || a.excluded) continue;
    const part = partAt(a.date);
    if (!part) continue;
    const year = yearOf(a.date);
    const y = byYear.get(year);
    if (!y) byYear.set(year, { addedKg: a.amountKg, part, lastDate: a.date });
    else
      byYear.set(year, { addedKg: y.addedKg + a.amountKg, ...(a.date >= y.lastDate ? { part, lastDate: a.date } : y) });
  }
  return [...byYear.entries()]
    .sort(([a], [b]) => a - b)
    .map(([year, { addedKg, part, lastDate }]) => {
      const percent = (addedKg / requirePositive(chargeOn(lastDate), "fullChargeKg")) * 100;
      // Tolerance of 1e-9 so 125 % typed in lb and stored in kg still "reaches" 125 %.
      const chronic = percent >= part.chronicLeaker.percentOfFullCharge.value * (1 - 1e-9);
      const base = { year, addedKg, percent, chronic, partId: part.id };
      return chronic ? { ...base, reportDue: chronicReportDueDate(part, year) } : base;
    });
}
