import { DomainInputError } from "../input-error";

/**
 * A calendar date as `YYYY-MM-DD`, meaning a day on the store's wall calendar (its time zone is
 * applied when an instant becomes a date, see time-zone.ts). Arithmetic runs on day numbers
 * through Date.UTC, which has no daylight-saving or zone effects and handles leap years.
 */
export type IsoDate = string;

const ISO = /^(\d{4})-(\d{2})-(\d{2})$/;
const DAY_MS = 86_400_000;

export interface DateParts {
  year: number;
  month: number; // 1-12
  day: number;
}

export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

export function daysInMonth(year: number, month: number): number {
  return new Date(Date.UTC(year, month, 0)).getUTCDate();
}

/** Parses and checks a real calendar date (2026-02-30 is refused, 2028-02-29 accepted). */
export function parseIsoDate(text: string, field = "date"): DateParts {
  const m = typeof text === "string" ? ISO.exec(text) : null;
  if (!m) throw new DomainInputError(field, `must be a date as YYYY-MM-DD, got ${JSON.stringify(text)}`);
  const year = Number(m[1]);
  const month = Number(m[2]);
  const day = Number(m[3]);
  if (month < 1 || month > 12) throw new DomainInputError(field, `has no month ${month}: ${text}`);
  if (day < 1 || day > daysInMonth(year, month)) {
    throw new DomainInputError(
      field,
      `${text} does not exist (month ${month} of ${year} has ${daysInMonth(year, month)} days)`,
    );
  }
  return { year, month, day };
}

function pad(n: number, width: number): string {
  return String(n).padStart(width, "0");
}

export function formatIsoDate({ year, month, day }: DateParts): IsoDate {
  return `${pad(year, 4)}-${pad(month, 2)}-${pad(day, 2)}`;
}

/** Days since 1970-01-01 (negative before). */
export function toDayNumber(date: IsoDate, field = "date"): number {
  const { year, month, day } = parseIsoDate(date, field);
  return Date.UTC(year, month - 1, day) / DAY_MS;
}

export function fromDayNumber(dayNumber: number): IsoDate {
  if (!Number.isInteger(dayNumber)) throw new DomainInputError("dayNumber", `must be a whole number, got ${dayNumber}`);
  const d = new Date(dayNumber * DAY_MS);
  return formatIsoDate({ year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate() });
}

export function addDays(date: IsoDate, days: number, field = "date"): IsoDate {
  if (!Number.isInteger(days)) throw new DomainInputError("days", `must be a whole number, got ${days}`);
  return fromDayNumber(toDayNumber(date, field) + days);
}

/** Whole days from `from` to `to` (positive when `to` is later). */
export function daysBetween(from: IsoDate, to: IsoDate): number {
  return toDayNumber(to, "to") - toDayNumber(from, "from");
}

/**
 * Adds calendar months, clamping to the last day of a shorter month: 31 Jan + 1 month is 28 Feb
 * (29 Feb in a leap year), and 29 Feb 2028 + 12 months is 28 Feb 2029. This is how "every 6 months"
 * is read for inspection intervals (no published rule found for the clamping; common practice).
 */
export function addMonths(date: IsoDate, months: number, field = "date"): IsoDate {
  if (!Number.isInteger(months)) throw new DomainInputError("months", `must be a whole number, got ${months}`);
  const { year, month, day } = parseIsoDate(date, field);
  const index = year * 12 + (month - 1) + months;
  const y = Math.floor(index / 12);
  const mo = index - y * 12 + 1;
  return formatIsoDate({ year: y, month: mo, day: Math.min(day, daysInMonth(y, mo)) });
}

/** Negative, zero or positive like a sort comparator; both dates are checked. */
export function compareDates(a: IsoDate, b: IsoDate): number {
  return toDayNumber(a, "a") - toDayNumber(b, "b");
}

export function yearOf(date: IsoDate, field = "date"): number {
  return parseIsoDate(date, field).year;
}
