/**
 * The difference map's own diverging ramp (later minus earlier): blue where the later sweep reads
 * lower, a neutral light grey at no change, copper-brown where it reads higher. Lightness falls
 * symmetrically from the neutral middle to both ends; blue against orange-brown stays apart for
 * red–green colour-blind readers (checked in the tests).
 */
import { scaleSymlog } from "d3-scale";
import { buildLabLut, LUT_SIZE } from "./concentration-ramp";
import type { Rgb } from "./colour-science";

export const DIFFERENCE_STOPS: readonly (readonly [number, number, number])[] = [
  [28, 0, -30], // deep blue: lower than before
  [62, -18, -22],
  [95, 0, 0], // no change
  [66, 22, 40],
  [34, 30, 36], // copper-brown: higher than before
];

export const DIFFERENCE_LUT = buildLabLut(DIFFERENCE_STOPS);

export interface DifferenceScale {
  maxAbsPpm: number;
  index(deltaPpm: number): number;
  colour(deltaPpm: number): Rgb;
  ticks(): number[];
}

/** Symmetric log around zero so a 3 ppm change stays visible next to a 200 ppm one. */
export function createDifferenceScale(maxAbsPpm: number): DifferenceScale {
  if (!(Number.isFinite(maxAbsPpm) && maxAbsPpm > 0))
    throw new RangeError(`maxAbsPpm: must be a positive number of ppm, got ${maxAbsPpm}`);
  const s = scaleSymlog().constant(1).domain([-maxAbsPpm, maxAbsPpm]).range([0, 1]).clamp(true);
  const index = (d: number) => Math.round(s(d) * (LUT_SIZE - 1));
  return {
    maxAbsPpm,
    index,
    colour(d) {
      const i = index(d) * 3;
      return [DIFFERENCE_LUT[i], DIFFERENCE_LUT[i + 1], DIFFERENCE_LUT[i + 2]];
    },
    ticks() {
      const out = [0];
      for (let p = 1; p < maxAbsPpm; p *= 10) out.push(p, -p);
      out.push(maxAbsPpm, -maxAbsPpm);
      return out.sort((a, b) => a - b);
    },
  };
}
