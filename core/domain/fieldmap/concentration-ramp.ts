/**
 * Plumeline's own field-map ramp: pale sand for air at background, through ochre and brick to a deep
 * plum at the top of the scale. Lightness falls steadily from end to end (the L* values of the stops
 * are chosen in CIE L*a*b* and interpolated there, so L* is linear between stops) and the hues run
 * along the yellow–blue axis that red–green colour-blind readers keep, so both ends stay apart for them
 * (checked in concentration-ramp.test.ts).
 */
import { scaleLinear, scaleSymlog } from "d3-scale";
import { interpolateLab } from "d3-interpolate";
import { labToRgb, parseRgb, rgbToHex, type Rgb } from "./colour-science";

/** The stops as CIE L*a*b* (L*, a*, b*): our design, kept inside the sRGB gamut. */
export const CONCENTRATION_STOPS: readonly (readonly [number, number, number])[] = [
  [97, -2, 14], // pale sand
  [82, 6, 48], // ochre
  [64, 30, 52], // amber-brick
  [46, 44, 26], // brick red
  [30, 38, -18], // plum
  [14, 20, -30], // deep indigo-plum
];

export const LUT_SIZE = 256;

/** Samples a piecewise CIE L*a*b* ramp through the stops into a LUT of `size` RGB triples. */
export function buildLabLut(stops: readonly (readonly [number, number, number])[], size = LUT_SIZE): Uint8ClampedArray {
  const colours = stops.map(([l, a, b]) => rgbToHex(labToRgb(l, a, b)));
  const t = scaleLinear<string>()
    .domain(colours.map((_, i) => i / (colours.length - 1)))
    .range(colours)
    .interpolate(interpolateLab);
  const lut = new Uint8ClampedArray(size * 3);
  for (let i = 0; i < size; i++) {
    const [r, g, b] = parseRgb(t(i / (size - 1)));
    lut[i * 3] = r;
    lut[i * 3 + 1] = g;
    lut[i * 3 + 2] = b;
  }
  return lut;
}

export const CONCENTRATION_LUT = buildLabLut(CONCENTRATION_STOPS);

export interface ConcentrationScaleOptions {
  /** Top of the scale in ppm (readings span 0–500 ppm). */
  maxPpm: number;
  /** Symmetric log (d3 scaleSymlog, constant 1 ppm) so 1, 10 and 100 ppm are equally far apart. */
  log: boolean;
}

export interface ConcentrationScale {
  maxPpm: number;
  log: boolean;
  /** ppm → 0..1 position on the ramp (clamped). */
  position(ppm: number): number;
  /** ppm → LUT index 0..255. */
  index(ppm: number): number;
  colour(ppm: number): Rgb;
  /** Legend ticks in ppm. */
  ticks(): number[];
}

export function createConcentrationScale({ maxPpm, log }: ConcentrationScaleOptions): ConcentrationScale {
  if (!(Number.isFinite(maxPpm) && maxPpm > 0))
    throw new RangeError(`maxPpm: must be a positive number of ppm, got ${maxPpm}`);
  const s = log
    ? scaleSymlog().constant(1).domain([0, maxPpm]).range([0, 1]).clamp(true)
    : scaleLinear().domain([0, maxPpm]).range([0, 1]).clamp(true);
  const index = (ppm: number) => Math.round(s(Math.max(0, ppm)) * (LUT_SIZE - 1));
  return {
    maxPpm,
    log,
    position: (ppm) => s(Math.max(0, ppm)),
    index,
    colour(ppm) {
      const i = index(ppm) * 3;
      return [CONCENTRATION_LUT[i], CONCENTRATION_LUT[i + 1], CONCENTRATION_LUT[i + 2]];
    },
    ticks() {
      if (!log) return scaleLinear().domain([0, maxPpm]).ticks(5);
      const out = [0];
      for (let p = 1; p <= maxPpm; p *= 10) out.push(p);
      if (out[out.length - 1] !== maxPpm) out.push(maxPpm);
      return out;
    },
  };
}

/** A readable top of scale: the next 1-2-5 step above the highest value, at least the alarm level. */
export function niceMaxPpm(highest: number, alarmPpm = 2): number {
  const top = Math.max(highest, alarmPpm * 2, 1);
  const p = 10 ** Math.floor(Math.log10(top));
  for (const m of [1, 2, 5, 10]) if (m * p >= top) return m * p;
  return 10 * p;
}
