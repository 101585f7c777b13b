import { DomainInputError } from "../input-error";
import { addDays, formatIsoDate, parseIsoDate, type IsoDate } from "./calendar-date";

/**
 * Store time zones are IANA names (America/Chicago, Europe/Berlin). Intl does the zone maths so
 * client and server agree without a date library; formatters are cached per zone because building
 * one is the slow part.
 */
const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string, field: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    try {
      f = new Intl.DateTimeFormat("en-US", {
        timeZone,
        hourCycle: "h23",
        year: "numeric",
        month: "2-digit",
        day: "2-digit",
        hour: "2-digit",
        minute: "2-digit",
        second: "2-digit",
      });
    } catch {
      throw new DomainInputError(field, `is not a known IANA time zone: ${JSON.stringify(timeZone)}`);
    }
    formatters.set(timeZone, f);
  }
  return f;
}

/** Throws unless `timeZone` is an IANA zone name this runtime knows. */
export function assertTimeZone(timeZone: string, field = "timeZone"): void {
  if (typeof timeZone !== "string" || timeZone.trim() === "") throw new DomainInputError(field, "is empty");
  formatterFor(timeZone, field);
}

function wallClock(instant: Date, timeZone: string, field: string) {
  if (!(instant instanceof Date) || Number.isNaN(instant.getTime())) {
    throw new DomainInputError("instant", "must be a valid Date");
  }
  const parts: Record<string, number> = {};
  for (const p of formatterFor(timeZone, field).formatToParts(instant)) {
    if (p.type !== "literal") parts[p.type] = Number(p.value);
  }
  return parts as { year: number; month: number; day: number; hour: number; minute: number; second: number };
}

/** The store's calendar date at an instant: 03:00 UTC on 1 Jan is still 31 Dec in New York. */
export function localDateOf(instant: Date, timeZone: string, field = "timeZone"): IsoDate {
  const w = wallClock(instant, timeZone, field);
  return formatIsoDate({ year: w.year, month: w.month, day: w.day });
}

/** Zone offset in milliseconds at an instant (local wall clock minus UTC; −5 h in New York in winter). */
export function zoneOffsetMs(instant: Date, timeZone: string, field = "timeZone"): number {
  const w = wallClock(instant, timeZone, field);
  const asUtc = Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second);
  return asUtc - Math.floor(instant.getTime() / 1000) * 1000;
}

/**
 * The first instant of a calendar day in a zone. Two passes settle the offset across a
 * daylight-saving change; where midnight itself is skipped (some zones shift at 00:00) the day
 * starts at the first existing minute, which the final check walks forward to.
 */
export function startOfLocalDay(date: IsoDate, timeZone: string, field = "timeZone"): Date {
  const { year, month, day } = parseIsoDate(date);
  const wall = Date.UTC(year, month - 1, day);
  let guess = wall - zoneOffsetMs(new Date(wall), timeZone, field);
  guess = wall - zoneOffsetMs(new Date(guess), timeZone, field);
  // If the guess fell on the previous day (a skipped midnight), step forward to the new day.
  while (localDateOf(new Date(guess), timeZone, field) < date) guess += 60_000;
  while (localDateOf(new Date(guess - 60_000), timeZone, field) === date) guess -= 60_000;
  return new Date(guess);
}

/** The instant a deadline on `date` passes: the start of the next local day. */
export function endOfLocalDay(date: IsoDate, timeZone: string, field = "timeZone"): Date {
  return startOfLocalDay(addDays(date, 1), timeZone, field);
}
