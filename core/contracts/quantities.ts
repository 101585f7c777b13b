import { z } from "zod";

// The plausible range of every physical quantity the contracts accept, stated once. Wide enough for
// real plants, narrow enough that a unit slip or a hostile 1e308 is refused at the field instead of
// storing an infinite plan or a row PostgreSQL cannot hold.

/** Longest side of a plan: a big hypermarket or distribution centre is a few hundred metres. */
export const PLAN_MAX_SIDE_M = 2000;
/** Plan coordinates may sit a little outside the drawing (a point off the edge is refused later, by bounds). */
export const PLAN_COORD_MAX_M = PLAN_MAX_SIDE_M;
/** Shortest length a calibration line or blank plan may have (a 10 cm line cannot scale a store). */
export const PLAN_MIN_LENGTH_M = 0.1;
/** Image coordinates: the pixel budget allows at most a few tens of thousands of pixels a side. */
export const IMAGE_COORD_MAX_PX = 100_000;
/** One full refrigerant charge or one addition. Supermarket racks hold 1,000–5,000 lb; industrial
 * ammonia plants far more (tens of thousands of kg, from memory); 100,000 of either unit covers both. */
export const CHARGE_MAX = 100_000;
/** A concentration cannot exceed a million parts per million. */
export const PPM_PHYSICAL_MAX = 1_000_000;
/** GWP (100-year): the highest listed for a refrigerant-related gas is tens of thousands (SF6 ≈ 25,000,
 * IPCC AR6 WG1 table 7.SM.7); 100,000 leaves room. */
export const GWP_MAX = 100_000;
/** Detector response: transport delay and time constant in seconds, kept to tenths of a second so
 * each distinct value is a real setting, not a new analysis per float. */
export const DETECTOR_SECONDS_MAX = 60;
export const SECONDS_STEP = 0.1;
/** Alarm levels to a hundredth of a ppm (the finest a hand detector displays is 0.1 ppm, from memory). */
export const PPM_STEP = 0.01;

const fmt = (n: number) => n.toLocaleString("en-US");

/** A finite number within [min, max], with the unit in every message. */
export function bounded(unit: string, min: number, max: number, options: { aboveMin?: boolean } = {}) {
  const base = z.number(`must be a finite number of ${unit}`).finite(`must be a finite number of ${unit}`);
  return (
    options.aboveMin
      ? base.gt(min, `must be more than ${fmt(min)} ${unit}`)
      : base.min(min, `must be ${fmt(min)} ${unit} or more`)
  ).max(max, `must be at most ${fmt(max)} ${unit}`);
}

/** Rounded to `step` before the range is checked: a hostile 1e-300 becomes 0, not a new value. */
export function stepped(unit: string, min: number, max: number, step: number) {
  const digits = Math.max(0, -Math.floor(Math.log10(step)));
  return z
    .number(`must be a number of ${unit}`)
    .finite(`must be a finite number of ${unit}`)
    .transform((v) => Number((Math.round(v / step) * step).toFixed(digits)))
    .pipe(bounded(unit, min, max));
}
