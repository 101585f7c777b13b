import Papa from "papaparse";
import { PPM_CEILING, type SamplePoint } from "#core/contracts/sweeps";

// A detector's own data log (CSV of time and ppm), read here so the user can map its columns and
// line it up with the sweep's taps by a clock offset. Pure: the text comes from a File elsewhere.

export interface LogTable {
  headers: string[];
  /** Data rows with their 1-based line numbers in the file. */
  rows: { line: number; cells: string[] }[];
}

export interface BadRow {
  line: number;
  reason: string;
}

export interface LogSample {
  line: number;
  timeMs: number;
  ppm: number;
  atLeast: boolean;
}

/** Splits the CSV; the first non-empty line is taken as the header row. */
export function readLogTable(text: string): LogTable {
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ""), { header: false, skipEmptyLines: false });
  const lines = parsed.data
    .map((cells, i) => ({ line: i + 1, cells: cells.map((c) => c.trim()) }))
    .filter((r) => r.cells.some((c) => c !== ""));
  if (lines.length === 0) return { headers: [], rows: [] };
  return { headers: lines[0].cells, rows: lines.slice(1) };
}

const TIME_OF_DAY = /^(\d{1,2}):(\d{2})(?::(\d{2})(?:\.(\d{1,3}))?)?$/;

/**
 * A log time as an instant. Full dates (ISO 8601 or "YYYY-MM-DD HH:MM:SS") are read as given
 * (local time when no zone); a bare time of day is taken on the sweep's start day, local time;
 * a plain number is seconds from the sweep's start.
 */
export function parseLogTime(cell: string, sweepStartMs: number): number | null {
  if (cell === "") return null;
  if (/^-?\d+(\.\d+)?$/.test(cell)) return sweepStartMs + Number(cell) * 1000;
  const tod = TIME_OF_DAY.exec(cell);
  if (tod) {
    const [, h, m, s = "0", ms = "0"] = tod;
    if (+h > 23 || +m > 59 || +s > 59) return null;
    const d = new Date(sweepStartMs);
    d.setHours(+h, +m, +s, Number(ms.padEnd(3, "0")));
    return d.getTime();
  }
  const t = Date.parse(cell.replace(/^(\d{4}-\d{2}-\d{2}) (\d)/, "$1T$2"));
  return Number.isFinite(t) ? t : null;
}

/** Reads the mapped columns; each bad row is reported with its line number and reason. */
export function readLogSamples(
  table: LogTable,
  timeColumn: number,
  ppmColumn: number,
  sweepStartMs: number,
): { samples: LogSample[]; bad: BadRow[] } {
  const samples: LogSample[] = [];
  const bad: BadRow[] = [];
  const name = (i: number) => table.headers[i] || `column ${i + 1}`;
  for (const { line, cells } of table.rows) {
    const timeCell = cells[timeColumn] ?? "";
    const ppmCell = (cells[ppmColumn] ?? "").replace(/\s*ppm$/i, "");
    const timeMs = parseLogTime(timeCell, sweepStartMs);
    if (timeMs === null) {
      bad.push({
        line,
        reason: timeCell === "" ? `${name(timeColumn)} is empty` : `${name(timeColumn)} "${timeCell}" is not a time`,
      });
      continue;
    }
    const over = /^(>=?|≥)\s*/.exec(ppmCell);
    const number = over ? ppmCell.slice(over[0].length) : ppmCell;
    const ppm = number === "" ? NaN : Number(number);
    if (!Number.isFinite(ppm)) {
      bad.push({
        line,
        reason:
          ppmCell === "" ? `${name(ppmColumn)} is empty` : `${name(ppmColumn)} "${ppmCell}" is not a number of ppm`,
      });
      continue;
    }
    if (ppm < 0) bad.push({ line, reason: `${name(ppmColumn)} ${ppm} is below 0 ppm` });
    else if (ppm > PPM_CEILING)
      bad.push({
        line,
        reason: `${name(ppmColumn)} ${ppm} is above the ${PPM_CEILING.toLocaleString("en-US")} ppm instrument ceiling`,
      });
    else samples.push({ line, timeMs, ppm, atLeast: over !== null });
  }
  return { samples, bad };
}

export interface TapPosition {
  x: number;
  y: number;
  takenAtMs: number;
  samplePoint: SamplePoint;
}

export interface AlignedSample {
  line: number;
  x: number;
  y: number;
  takenAt: string;
  ppm: number;
  atLeast: boolean;
  samplePoint: SamplePoint;
}

/**
 * Places each log sample on the walked path: its time plus the clock offset (the detector's clock
 * minus the device's is −offset) is matched to the taps and interpolated between the two around it.
 * Samples outside the tapped span cannot be placed and are reported.
 */
export function alignLog(
  samples: readonly LogSample[],
  taps: readonly TapPosition[],
  offsetS: number,
): { placed: AlignedSample[]; bad: BadRow[] } {
  const placed: AlignedSample[] = [];
  const bad: BadRow[] = [];
  const sorted = [...taps].sort((a, b) => a.takenAtMs - b.takenAtMs);
  if (sorted.length === 0)
    return {
      placed,
      bad: samples.map((s) => ({ line: s.line, reason: "the sweep has no tapped positions to line the log up with" })),
    };
  const first = sorted[0].takenAtMs;
  const last = sorted[sorted.length - 1].takenAtMs;
  for (const s of samples) {
    const t = s.timeMs + offsetS * 1000;
    if (t < first || t > last) {
      bad.push({
        line: s.line,
        reason: `at this clock offset its time falls ${t < first ? "before the first" : "after the last"} tapped position`,
      });
      continue;
    }
    let j = 0;
    while (j < sorted.length - 2 && sorted[j + 1].takenAtMs <= t) j++;
    const a = sorted[j];
    const b = sorted[Math.min(j + 1, sorted.length - 1)];
    const span = b.takenAtMs - a.takenAtMs;
    const f = span > 0 ? (t - a.takenAtMs) / span : 0;
    placed.push({
      line: s.line,
      x: a.x + f * (b.x - a.x),
      y: a.y + f * (b.y - a.y),
      takenAt: new Date(t).toISOString(),
      ppm: s.ppm,
      atLeast: s.atLeast,
      samplePoint: (f < 0.5 ? a : b).samplePoint,
    });
  }
  return { placed, bad };
}
