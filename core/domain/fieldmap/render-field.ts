/**
 * Paints a field grid into RGBA pixels, one pixel per cell (the canvas or jimp scales it over the plan
 * without smoothing). Known cells take the ramp's colour, faded where few readings back them; unknown
 * cells get a diagonal hatch with clear gaps so the plan shows through — unknown is never painted as
 * the "clean" end of the ramp.
 */
import { checkFieldGrid, FULL_CONFIDENCE, UNKNOWN_BELOW, type FieldGridLike } from "./field-grid";

export interface RenderOptions {
  /** 256 RGB triples (CONCENTRATION_LUT or DIFFERENCE_LUT). */
  lut: Uint8ClampedArray;
  /** Value → LUT index. */
  index(value: number): number;
  /** Opacity of a fully confident cell, 0..255 (the plan must stay readable under it). */
  opacity?: number;
  /** Hatch period in cells (a stripe every `hatch` cells along the diagonal). */
  hatch?: number;
}

export const HATCH_RGBA = [84, 88, 96, 120] as const;

export function renderFieldRgba(
  grid: FieldGridLike,
  options: RenderOptions,
  out?: Uint8ClampedArray,
): Uint8ClampedArray {
  checkFieldGrid(grid);
  const { width, height, values, confidence } = grid;
  const { lut, index } = options;
  if (lut.length < 256 * 3) throw new RangeError(`lut: expected 256 RGB entries, got ${lut.length / 3}`);
  const opacity = options.opacity ?? 200;
  const hatch = options.hatch ?? 6;
  const pixels = out ?? new Uint8ClampedArray(width * height * 4);
  if (pixels.length !== width * height * 4)
    throw new RangeError(`out: expected ${width * height * 4} bytes, got ${pixels.length}`);
  const span = FULL_CONFIDENCE - UNKNOWN_BELOW;
  for (let y = 0; y < height; y++) {
    const row = y * width;
    for (let x = 0; x < width; x++) {
      const k = row + x;
      const p = k * 4;
      const v = values[k];
      const c = confidence[k];
      if (!(v === v) || !(c >= UNKNOWN_BELOW)) {
        if ((x + y) % hatch === 0) {
          pixels[p] = HATCH_RGBA[0];
          pixels[p + 1] = HATCH_RGBA[1];
          pixels[p + 2] = HATCH_RGBA[2];
          pixels[p + 3] = HATCH_RGBA[3];
        } else {
          pixels[p + 3] = 0;
          pixels[p] = pixels[p + 1] = pixels[p + 2] = 0;
        }
        continue;
      }
      const i = index(v) * 3;
      pixels[p] = lut[i];
      pixels[p + 1] = lut[i + 1];
      pixels[p + 2] = lut[i + 2];
      const fade = c >= FULL_CONFIDENCE ? 1 : 0.35 + (0.65 * (c - UNKNOWN_BELOW)) / span;
      pixels[p + 3] = Math.round(opacity * fade);
    }
  }
  return pixels;
}
