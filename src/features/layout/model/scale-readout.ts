/**
 * The plan's scale in the member's units: the scale bar's round length ("50 cm", "6 in", "20 ft")
 * and a pixel's size on the drawing ("1 px = 0.6 in"), never centimetres to a feet-and-inches member.
 */
import { METRES_PER_INCH } from "#core/domain/units/length";
import type { LengthPreference } from "#core/domain/units/format-units";
import { pickScaleBar } from "./calibration";

export interface ScaleBarReadout {
  label: string;
  pixels: number;
}

const STEPS = [1, 2, 5];

/** The longest 1-2-5 count of `unitMetres` whose bar fits in `maxPixels`. */
function roundCount(metresPerScreenPixel: number, maxPixels: number, unitMetres: number): number {
  const max = (maxPixels * metresPerScreenPixel) / unitMetres;
  const e = Math.floor(Math.log10(max));
  const options = [e - 1, e].flatMap((k) => STEPS.map((s) => Number((s * 10 ** k).toPrecision(12))));
  return Math.max(...options.filter((v) => v <= max * (1 + 1e-12)));
}

/** A scale bar's length and label: metres (centimetres under 1 m), or feet (inches under 1 ft). */
export function scaleBarReadout(
  metresPerScreenPixel: number,
  maxPixels: number,
  preference: LengthPreference,
): ScaleBarReadout {
  if (preference === "ft-in") {
    const bar = pickScaleBar(metresPerScreenPixel, maxPixels, "ft");
    if (bar.value >= 1) return { label: `${bar.value} ft`, pixels: bar.pixels };
    const inches = roundCount(metresPerScreenPixel, maxPixels, METRES_PER_INCH);
    return { label: `${inches} in`, pixels: (inches * METRES_PER_INCH) / metresPerScreenPixel };
  }
  const bar = pickScaleBar(metresPerScreenPixel, maxPixels, "m");
  if (bar.value >= 1) return { label: `${bar.value} m`, pixels: bar.pixels };
  return { label: `${Number((bar.value * 100).toPrecision(12))} cm`, pixels: bar.pixels };
}

const significant = (v: number) => String(Number(v.toPrecision(3)));

/** One drawing pixel's length on the ground, to three significant figures: "1 px = 0.6 in", "1 px = 1.52 cm". */
export function pixelScaleText(metresPerPixel: number, preference: LengthPreference): string {
  if (!(Number.isFinite(metresPerPixel) && metresPerPixel > 0))
    throw new RangeError(`pixelScaleText: metresPerPixel must be above 0 (got ${metresPerPixel})`);
  if (preference === "ft-in") {
    const inches = metresPerPixel / METRES_PER_INCH;
    return inches >= 12 ? `1 px = ${significant(inches / 12)} ft` : `1 px = ${significant(inches)} in`;
  }
  if (metresPerPixel >= 1) return `1 px = ${significant(metresPerPixel)} m`;
  if (metresPerPixel >= 0.001) return `1 px = ${significant(metresPerPixel * 100)} cm`;
  return `1 px = ${significant(metresPerPixel * 1000)} mm`;
}
