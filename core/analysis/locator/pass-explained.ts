import type { PlanGrid } from "../grid/plan-grid";
import { accumulateReadingFields, sumWeightedKernelTimes } from "./reading-fields";
import { scanSources, scanTotals } from "./source-scan";
import type { SourceKernel } from "./source-kernel";

/**
 * How well a pass's own air model explains its own readings: the share of their weighted scatter
 * (χ² of the background alone) that the best single source in that air removes, 0 … 1. A still-air
 * pass whose readings no source in still air accounts for (a front that reads nothing at first, then
 * a rise; gas that pooled inside the case and seeps out unevenly) says little about where the leak is.
 */
export function passExplained(
  grid: PlanGrid,
  readings: { xs: Float64Array; ys: Float64Array; ppm: Float64Array; w: Float64Array },
  kernel: SourceKernel,
  mapSigmaM: number,
  stepScale: Float32Array | null,
): number {
  const { xs, ys, ppm, w } = readings;
  if (ppm.length < 2) return 0;
  const fields = accumulateReadingFields(grid, xs, ys, ppm, w, kernel, mapSigmaM, stepScale);
  const cells = grid.width * grid.height;
  const totals = scanTotals(w, ppm);
  const sumWGR = sumWeightedKernelTimes(fields, w, ppm, new Float64Array(cells));
  const scan = scanSources(fields.sumWG, fields.sumWGG, sumWGR, totals, new Uint8Array(cells).fill(1));
  if (!(scan.chi2Background > 0)) return 0;
  let best = 0;
  for (let c = 0; c < cells; c++) if (scan.delta[c] > best) best = scan.delta[c];
  return Math.min(1, best / scan.chi2Background);
}
