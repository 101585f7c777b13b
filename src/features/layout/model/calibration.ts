/**
 * Scale calibration: metres per pixel from a line of known real length drawn on the image;
 * what a re-calibration does to the fixtures; and the scale bar's length.
 */
import { IDENTITY, type Similarity } from "#core/analysis/geometry/similarity";
import { fromMetres, toMetres, type LengthUnit } from "#core/analysis/geometry/units";
import type { Fixture } from "#core/contracts/fixtures";
import type { ImagePoint } from "../../../lib/plan-view/coordinates";
import { scaleFixture } from "./fixture-geometry";

/** A drawn line shorter than this is too imprecise to calibrate from (a few pixels of error). */
export const MIN_CALIBRATION_PIXELS = 10;

export interface RealLength {
  value: number;
  unit: LengthUnit;
}

/**
 * Metres per image pixel from the drawn line a→b and its typed real length (feet converted at
 * exactly 0.3048 m, NIST SP 811). Throws a RangeError naming the problem.
 */
export function metresPerPixelFromLine(a: ImagePoint, b: ImagePoint, length: RealLength): number {
  if (![a.x, a.y, b.x, b.y].every(Number.isFinite))
    throw new RangeError("the calibration line's ends must be finite pixel positions");
  if (!(Number.isFinite(length.value) && length.value > 0))
    throw new RangeError(`the real length must be more than 0 ${length.unit}`);
  const pixels = Math.hypot(b.x - a.x, b.y - a.y);
  if (pixels < MIN_CALIBRATION_PIXELS) {
    throw new RangeError(
      `the calibration line is ${pixels.toFixed(1)} px long; draw it at least ${MIN_CALIBRATION_PIXELS} px long, ideally across a long known wall`,
    );
  }
  return toMetres(length.value, length.unit) / pixels;
}

/**
 * What a new scale means for a plan. Fixtures were drawn over the image, so their pixel
 * positions are what the lead tech meant: with a new scale their metres change by
 * newMpp / oldMpp about the origin. Without sweeps the fixtures are rescaled in place; with
 * sweeps a new plan version is made (old sweeps never move), aligned to this one by that scale.
 * Either way the plan's width and height in metres scale by the same factor.
 */
export type Recalibration =
  | { kind: "rescale-in-place"; factor: number }
  | { kind: "new-version"; factor: number; alignment: Similarity };

export function planRecalibration(
  oldMetresPerPixel: number,
  newMetresPerPixel: number,
  hasSweeps: boolean,
): Recalibration {
  for (const [name, v] of [
    ["oldMetresPerPixel", oldMetresPerPixel],
    ["newMetresPerPixel", newMetresPerPixel],
  ] as const) {
    if (!(Number.isFinite(v) && v > 0)) throw new RangeError(`${name} must be a finite number above 0, got ${v}`);
  }
  const factor = newMetresPerPixel / oldMetresPerPixel;
  return hasSweeps
    ? { kind: "new-version", factor, alignment: { ...IDENTITY, scale: factor } }
    : { kind: "rescale-in-place", factor };
}

/** Scales every fixture about the plan origin (vertices, points and door offsets and widths). */
export function rescaleFixtures<F extends Fixture>(fixtures: readonly F[], factor: number): F[] {
  if (!(Number.isFinite(factor) && factor > 0))
    throw new RangeError(`the rescale factor must be above 0, got ${factor}`);
  return fixtures.map((f) => scaleFixture(f, factor));
}

// 1-2-5 steps, the usual series for graduated scales (as in map scale bars).
const STEPS = [1, 2, 5];

export interface ScaleBar {
  /** The bar's length in the chosen unit, a round number (e.g. 5, 10, 20). */
  value: number;
  unit: LengthUnit;
  metres: number;
  /** The bar's length on screen. */
  pixels: number;
}

/**
 * The longest round length (1, 2 or 5 × 10^k, in m or ft) whose bar fits in `maxPixels`
 * at `metresPerScreenPixel` (from coordinates.stageLengthToPlan(1, ...)).
 */
export function pickScaleBar(metresPerScreenPixel: number, maxPixels: number, unit: LengthUnit): ScaleBar {
  if (!(Number.isFinite(metresPerScreenPixel) && metresPerScreenPixel > 0))
    throw new RangeError("metresPerScreenPixel must be above 0");
  if (!(Number.isFinite(maxPixels) && maxPixels > 0)) throw new RangeError("maxPixels must be above 0");
  const maxValue = fromMetres(maxPixels * metresPerScreenPixel, unit);
  const exponent = Math.floor(Math.log10(maxValue));
  let best = 0;
  for (let e = exponent - 1; e <= exponent; e++) {
    for (const s of STEPS) {
      const v = s * 10 ** e;
      if (v <= maxValue * (1 + 1e-12) && v > best) best = v;
    }
  }
  // Round away float noise such as 0.30000000000000004.
  best = Number(best.toPrecision(12));
  const metres = toMetres(best, unit);
  return { value: best, unit, metres, pixels: metres / metresPerScreenPixel };
}
