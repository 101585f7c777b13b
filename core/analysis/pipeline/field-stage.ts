import type { FieldGrid } from "../../contracts/locator-output";
import type { SearchFocus } from "../grid/geodesic-distance";
import type { PlanGrid } from "../grid/plan-grid";
import { estimateBackground } from "../locator/background";
import { fieldMap } from "../locator/field-map";
import { mergeReadingFields } from "../locator/merge-reading-fields";
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
  /** The kernel of the plan's own air (the first pass). */
  readonly kernel: SourceKernel;
  /** Fans stir gas far (most cases run their fans): the kernel has its far-field part. */
  readonly fansStir: boolean;
  /** One kernel per air model (`kernels[0]` is `kernel`), and the model of each reading. */
  readonly kernels: readonly SourceKernel[];
  readonly modelOfReading: Int32Array;
  /** One truncated geodesic search per sampled cell, feeding both the field map and the source scan. */
  readonly fields: ReadingFields;
  readonly map: FieldGrid;
}

/** The air of one model: whether fans stir it far, and the step scale inside fan-stirred rooms. */
export interface AirModel {
  readonly fansStir: boolean;
  readonly stepScale: Float32Array | null;
}

/** Readings taken in other air than the plan's (a pinpoint pass with the fans stopped): their models. */
export interface OtherAir {
  /** Models 1, 2, …; model 0 is the plan's own (`stepScale`, `fansStir`). */
  readonly models: readonly AirModel[];
  readonly modelOfReading: Int32Array;
  /** 1 for a reading that only says a stilled fixture's level (locator/mixed-level.ts): drawn on the map, fitted by no point source. */
  readonly levelOnly?: Uint8Array;
  /** Each model's weight on its readings' fit weights (1 for model 0): a pass weighed by how well its own air explains it. */
  readonly weightOfModel?: readonly number[];
}

/**
 * With `other`, each reading is searched with its own air's kernel and step scale (fans running: the
 * kernel's far-field part and the stirred rooms' short distances; fans stopped or a defrost: still air),
 * and the parts are joined so the sources stage fits one set of sources to every pass at once.
 */
export function fieldStage(
  grid: PlanGrid,
  stepScale: Float32Array | null,
  fansStir: boolean,
  lag: LagResult,
  zones: Pick<ZonesResult, "zoneOfReading">,
  settings: { kernel: KernelSettings; noise: NoiseSettings },
  /** Search only from these readings (a partial field, see accumulateReadingFields); null = all. */
  searched: Uint8Array | null = null,
  other: OtherAir | null = null,
  /** Only this circle's cells are wanted (see accumulateReadingFields); null = every cell. */
  focus: SearchFocus | null = null,
): FieldResult {
  const k = settings.kernel;
  const n = lag.ppm.length;
  const models: AirModel[] = [{ fansStir, stepScale }, ...(other?.models ?? [])];
  // the far-field part of the kernel is the fans' stirring; in still air the drift carries the gas
  const kernels = models.map((m) =>
    createSourceKernel(
      k.screeningLengthM,
      k.nearCutoffM,
      k.truncationM,
      m.fansStir && k.farShare > 0 ? { lengthM: k.farScreeningLengthM, share: k.farShare } : null,
    ),
  );
  const modelOfReading = other?.modelOfReading ?? new Int32Array(n);
  if (modelOfReading.length !== n) throw new Error("field stage: need one air model per reading");
  const usable = new Uint8Array(n);
  for (let i = 0; i < n; i++) usable[i] = !lag.censored[i] && zones.zoneOfReading[i] < 0 ? 1 : 0;
  const weights = readingWeights(lag.ppm, settings.noise);
  const scale = other?.weightOfModel;
  if (scale) for (let i = 0; i < n; i++) weights[i] *= scale[modelOfReading[i]];
  const fields = fieldsByModel(
    grid,
    lag,
    weights,
    models,
    kernels,
    modelOfReading,
    other?.levelOnly,
    k.mapSigmaM,
    searched,
    focus,
  );
  // the background and the map are worked out when first read: a retry screen reads neither (decision 0163)
  let background: FieldResult["background"] | undefined;
  let map: FieldGrid | undefined;
  return {
    get background() {
      return (background ??= estimateBackground(lag.ppm, usable));
    },
    weights,
    kernel: kernels[0],
    fansStir,
    kernels,
    modelOfReading,
    fields,
    get map() {
      return (map ??= fieldMap(fields, grid.width, grid.height, grid.cellSize));
    },
  };
}

function fieldsByModel(
  grid: PlanGrid,
  lag: LagResult,
  weights: Float64Array,
  models: readonly AirModel[],
  kernels: readonly SourceKernel[],
  modelOfReading: Int32Array,
  levelOnly: Uint8Array | undefined,
  mapSigmaM: number,
  searched: Uint8Array | null,
  focus: SearchFocus | null,
): ReadingFields {
  const n = lag.ppm.length;
  // a part per air model, and apart from it that model's level-only readings
  const partOf = (i: number) => 2 * modelOfReading[i] + (levelOnly?.[i] ? 1 : 0);
  const used = new Set(Array.from({ length: n }, (_, i) => partOf(i)));
  if (used.size === 1 && used.has(0))
    return accumulateReadingFields(
      grid,
      lag.xs,
      lag.ys,
      lag.ppm,
      weights,
      kernels[0],
      mapSigmaM,
      models[0].stepScale,
      searched,
      focus,
    );
  const parts = [...used]
    .sort((a, b) => a - b)
    .map((part) => {
      const m = part >> 1;
      const readings = Int32Array.from({ length: n }, (_, i) => i).filter((i) => partOf(i) === part);
      const pick = (a: Float64Array) => Float64Array.from(readings, (i) => a[i]);
      const fields = accumulateReadingFields(
        grid,
        pick(lag.xs),
        pick(lag.ys),
        pick(lag.ppm),
        pick(weights),
        kernels[m],
        mapSigmaM,
        models[m].stepScale,
        searched ? Uint8Array.from(readings, (i) => searched[i]) : null,
        focus,
      );
      return { fields: part & 1 ? withoutKernel(fields) : fields, readings };
    });
  return mergeReadingFields(parts, n, grid.width * grid.height);
}

/** The same readings on the map (Ω sums, nearest reading) with no kernel value anywhere: no source reaches them. */
function withoutKernel(f: ReadingFields): ReadingFields {
  return {
    ...f,
    start: new Int32Array(f.start.length),
    cell: new Int32Array(0),
    kernel: new Float32Array(0),
    dist: new Float32Array(0),
    sumWG: new Float64Array(f.sumWG.length),
    sumWGG: new Float64Array(f.sumWGG.length),
  };
}
