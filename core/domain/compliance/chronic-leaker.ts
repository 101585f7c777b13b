import { yearOf } from "../dates/calendar-date";
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
  /** The report's due date when chronic. */
  reportDue?: string;
}

/**
 * Refrigerant added per calendar year (the store's calendar: dates are already local) and whether
 * it reaches the chronic-leaker share of the full charge (≥ 125 % [S:R7]). Voided and excluded
 * additions (retrofit, new installation, seasonal variance) do not count as loss.
 */
export function chronicLeakerYears(
  part: LeakRatePart,
  fullChargeKg: number,
  additions: readonly ChargeAddition[],
): ChronicLeakerYear[] {
  requirePositive(fullChargeKg, "fullChargeKg");
  validateAdditions(additions);
  const byYear = new Map<number, number>();
  additions.forEach((a) => {
    if (a.voided || a.excluded) return;
    const year = yearOf(a.date);
    byYear.set(year, (byYear.get(year) ?? 0) + a.amountKg);
  });
  const limit = part.chronicLeaker.percentOfFullCharge.value;
  return [...byYear.entries()]
    .sort(([a], [b]) => a - b)
    .map(([year, addedKg]) => {
      const percent = (addedKg / fullChargeKg) * 100;
      // Tolerance of 1e-9 so 125 % typed in lb and stored in kg still "reaches" 125 %.
      const chronic = percent >= limit * (1 - 1e-9);
      return chronic
        ? { year, addedKg, percent, chronic, reportDue: chronicReportDueDate(part, year) }
        : { year, addedKg, percent, chronic };
    });
}
