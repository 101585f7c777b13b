import { formatInZone } from "#core/domain/dates/format-in-zone";

/** Times at a store are shown in the store's own time zone (docs/product.md), with the zone named. */
export function formatDateInZone(iso: string, timeZone: string): string {
  return formatInZone(iso, timeZone, "date");
}

export function formatDateTimeInZone(iso: string, timeZone: string): string {
  return formatInZone(iso, timeZone, "dateTime");
}
