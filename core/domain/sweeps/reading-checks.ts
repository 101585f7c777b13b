import {
  DEVICE_CLOCK_TOLERANCE_MS,
  READING_AFTER_START_MAX_MS,
  READING_BEFORE_START_TOLERANCE_MS,
} from "../../contracts/sweeps";

export interface ReadingContext {
  widthM: number;
  heightM: number;
  /** Device time of the sweep's start (same clock as the readings). */
  startedAtMs: number;
  /** Our clock when the reading arrived. */
  nowMs: number;
}

/** A micrometre past the edge after a zoom rounding is still on the plan. */
const EDGE_TOLERANCE_M = 1e-6;

/**
 * The checks zod cannot make alone: on the plan, and a time that fits the sweep. Times are
 * compared with the sweep's start, taken on the same device clock, so a clock that is off by
 * hours does not matter; only a time far from our clock too (a day) is refused.
 */
export function readingProblems(
  r: { x: number; y: number; takenAtMs: number },
  c: ReadingContext,
): Record<string, string> {
  const problems: Record<string, string> = {};
  const where = `the plan (0–${round(c.widthM)} m × 0–${round(c.heightM)} m)`;
  if (r.x < -EDGE_TOLERANCE_M || r.x > c.widthM + EDGE_TOLERANCE_M)
    problems.x = `${round(r.x)} m lies outside ${where}`;
  if (r.y < -EDGE_TOLERANCE_M || r.y > c.heightM + EDGE_TOLERANCE_M)
    problems.y = `${round(r.y)} m lies outside ${where}`;
  if (r.takenAtMs < c.startedAtMs - READING_BEFORE_START_TOLERANCE_MS) {
    problems.takenAt = `is ${minutes(c.startedAtMs - r.takenAtMs)} before the sweep started`;
  } else if (r.takenAtMs > c.startedAtMs + READING_AFTER_START_MAX_MS) {
    problems.takenAt = `is more than 24 h after the sweep started`;
  } else if (r.takenAtMs > c.nowMs + DEVICE_CLOCK_TOLERANCE_MS) {
    problems.takenAt = `is more than 24 h in the future (check the device's clock)`;
  }
  return problems;
}

function round(v: number): string {
  return String(Math.round(v * 100) / 100);
}

function minutes(ms: number): string {
  const m = Math.round(ms / 60_000);
  return m < 120 ? `${m} min` : `${Math.round(m / 60)} h`;
}
