import { formatCalendarDay, formatInZone } from "../dates/format-in-zone";

/** A day written as ISO 8601 inside stored text, not part of a longer token ("REF-2026-01-02" stays). */
const ISO_DAY = /(?<![\w-])(\d{4}-\d{2}-\d{2})(?![\w-])/g;

const isRealDay = (day: string) => {
  const d = new Date(`${day}T12:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === day;
};

/**
 * A stored audit summary with each ISO day in it written as every other day on the records
 * ("Retrofit from 2026-03-01" → "Retrofit from 1 Mar 2026"). The stored words stay as they are in the
 * archive; only the reading changes. A string that only looks like a day (2026-02-30) is left alone.
 */
export function readableDays(text: string): string {
  return text.replace(ISO_DAY, (day) => (isRealDay(day) ? formatCalendarDay(day) : day));
}

export interface AuditEntry {
  /** ISO 8601 instant (UTC), as stored. */
  at: string;
  by: string;
  summary: string;
}

/**
 * An audit row as a person reads it: the moment on the store's clock with its zone named
 * ("16 Feb 2026, 09:12 GMT-5", the one way moments are written, core/domain/dates/format-in-zone.ts),
 * who, and the summary with readable days (docs/decisions/0125-audit-trail-in-the-stores-time.md).
 */
export function readableAuditEntry(entry: AuditEntry, timeZone: string) {
  return { when: formatInZone(entry.at, timeZone, "dateTime"), by: entry.by, summary: readableDays(entry.summary) };
}
