import { unparseCsv } from "./csv-cells";

/** "fullChargeKg" → "full_charge_kg": the archive's headers are the database's column names. */
export function snakeCase(name: string): string {
  return name.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
}

/**
 * One cell as stored: an instant as ISO 8601 UTC, a list or object (sweep warnings, a reading's
 * values before an edit) as JSON, nothing as an empty cell. Numbers stay numbers, written in full
 * so that reading the file back gives the stored value (a record set, not a report: no rounding).
 */
export function storedCell(v: unknown): string | number | boolean {
  if (v === null || v === undefined) return "";
  if (v instanceof Date) return v.toISOString();
  if (typeof v === "number" || typeof v === "boolean" || typeof v === "string") return v;
  return JSON.stringify(v);
}

/**
 * A table as CSV with a header of snake_case column names; formula-like text is escaped (decision 0025).
 * An instant column's header ends in `_utc` ("recorded_at_utc"), so a reader knows the zone without
 * the readme (docs/decisions/0125-audit-trail-in-the-stores-time.md).
 */
export function tableCsv(
  columns: readonly string[],
  rows: readonly Record<string, unknown>[],
  instants: readonly string[] = [],
): string {
  return unparseCsv({
    fields: columns.map((c) => (instants.includes(c) ? `${snakeCase(c)}_utc` : snakeCase(c))),
    data: rows.map((r) => columns.map((c) => storedCell(r[c]))),
  });
}
