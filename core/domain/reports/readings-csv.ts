/**
 * The readings of a sweep as CSV: raw tap and lag-corrected positions side by side, in the reader's
 * length unit (metres, or decimal feet — a spreadsheet cannot sum "12 ft 3 in"), times in the store's
 * zone. Text cells are escaped against formula injection (csv-cells.ts).
 */
import { unparseCsv } from "./csv-cells";
import { metresToFeet } from "../units/length";
import type { LengthPreference } from "../units/format-units";

export interface CsvReading {
  id: string;
  takenAt: Date;
  /** Seconds from the sweep's start. */
  t: number;
  raw: { x: number; y: number };
  corrected: { x: number; y: number } | null;
  ppm: number;
  atLeast: boolean;
  samplePoint: string;
  note: string;
  flags: string[];
}

function localTime(d: Date, timeZone: string): string {
  // sv-SE gives an ISO-like "2026-03-04 14:05:09"
  return new Intl.DateTimeFormat("sv-SE", {
    timeZone,
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
    second: "2-digit",
    hour12: false,
  }).format(d);
}

export function readingsCsvColumns(unit: LengthPreference): string[] {
  const u = unit === "m" ? "m" : "ft";
  return [
    "reading_id",
    "local_time",
    "seconds_from_start",
    `raw_x_${u}`,
    `raw_y_${u}`,
    `corrected_x_${u}`,
    `corrected_y_${u}`,
    "ppm",
    "at_least",
    "sample_point",
    "flags",
    "note",
  ];
}

export function readingsCsv(rows: readonly CsvReading[], unit: LengthPreference, timeZone: string): string {
  const len = (m: number) => (unit === "m" ? Number(m.toFixed(3)) : Number(metresToFeet(m).toFixed(3)));
  const data = rows.map((r) => [
    r.id,
    localTime(r.takenAt, timeZone),
    Number(r.t.toFixed(3)),
    len(r.raw.x),
    len(r.raw.y),
    r.corrected ? len(r.corrected.x) : "",
    r.corrected ? len(r.corrected.y) : "",
    r.ppm,
    r.atLeast ? "yes" : "no",
    r.samplePoint,
    r.flags.join(" "),
    r.note,
  ]);
  return unparseCsv({ fields: readingsCsvColumns(unit), data });
}
