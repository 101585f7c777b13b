import { CONCENTRATION_LUT, createConcentrationScale, niceMaxPpm } from "#core/domain/fieldmap/concentration-ramp";
import type { FieldPaint } from "./draw-field-layer";

/** One ppm scale for a set of readings (so compared sweeps share colours). */
export function concentrationPaint(readingsPpm: readonly number[], alarmPpm: number, log: boolean) {
  const maxPpm = niceMaxPpm(Math.max(0, ...readingsPpm), alarmPpm);
  const scale = createConcentrationScale({ maxPpm, log });
  const paint: FieldPaint = { lut: CONCENTRATION_LUT, index: scale.index };
  return { scale, paint };
}
