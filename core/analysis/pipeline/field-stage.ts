import type { FieldGrid } from "../../contracts/locator-output";
import type { PlanGrid } from "../grid/plan-grid";
import { estimateBackground } from "../locator/background";
import { fieldMap } from "../locator/field-map";
import { accumulateReadingFields, type ReadingFields } from "../locator/reading-fields";
import type { KernelSettings, NoiseSettings } from "../locator/settings";
import { createSourceKernel, type SourceKernel } from "../locator/source-kernel";
import type { LagResult } from "./lag-stage";
import { readingWeights } from "./numbers";
import type { ZonesResult } from "./zones-stage";

/** Stage 3: the background, the reading weights, the source kernel, the per-cell sums and the field map. */
export interface FieldResult {
  readonly background: { readonly ppm: number; readonly spread: number };
  /** Fit weight of each reading (noise model). */
  readonly weights: Float64Array;
  readonly kernel: SourceKernel;
  /** Fans stir gas far (most cases run their fans): the kernel has its far-field part. */
  readonly fansStir: boolean;
  /** One truncated geodesic search per sampled cell, feeding both the field map and the source scan. */
  readonly fields: ReadingFields;
  readonly map: FieldGrid;
}

export function fieldStage(
  grid: PlanGrid,
  stepScale: Float32Array | null,
  fansStir: boolean,
  lag: LagResult,
  zones: Pick<ZonesResult, "zoneOfReading">,
  settings: { kernel: KernelSettings; noise: NoiseSettings },
  /** Search only from these readings (a partial field, see accumulateReadingFields); null = all. */
  searched: Uint8Array | null = null,
): FieldResult {
  const k = settings.kernel;
  const n = lag.ppm.length;
  // the far-field part of the kernel is the fans' stirring; in still air the drift carries the gas
  const kernel = createSourceKernel(
    k.screeningLengthM,
    k.nearCutoffM,
    k.truncationM,
    fansStir && k.farShare > 0 ? { lengthM: k.farScreeningLengthM, share: k.farShare } : null,
  );
  const usable = new Uint8Array(n);
  for (let i = 0; i < n; i++) usable[i] = !lag.censored[i] && zones.zoneOfReading[i] < 0 ? 1 : 0;
  const weights = readingWeights(lag.ppm, settings.noise);
  const fields = accumulateReadingFields(
    grid,
    lag.xs,
    lag.ys,
    lag.ppm,
    weights,
    kernel,
    k.mapSigmaM,
    stepScale,
    searched,
  );
  return {
    background: estimateBackground(lag.ppm, usable),
    weights,
    kernel,
    fansStir,
    fields,
    map: fieldMap(fields, grid.width, grid.height, grid.cellSize),
  };
}
