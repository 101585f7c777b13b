import type { NoiseSettings } from "../locator/settings";

export function medianOf(v: Float64Array): number {
  const s = Float64Array.from(v).sort();
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Noise model: w = 1/(a + β·y)², an additive floor plus a multiplicative share. */
export function readingWeights(y: Float64Array, noise: NoiseSettings): Float64Array {
  return Float64Array.from(y, (v) => 1 / (noise.floorPpm + noise.fraction * v) ** 2);
}

/** Distance between two cells of a row-major grid `width` wide, in cells. */
export function cellDistance(a: number, b: number, width: number): number {
  const ai = a % width;
  const bi = b % width;
  return Math.hypot(ai - bi, (a - ai) / width - (b - bi) / width);
}

export const round2 = (v: number) => Math.round(v * 100) / 100;
