import { GeodesicSearch } from "../grid/geodesic-distance";
import type { PlanGrid } from "../grid/plan-grid";
import { fitNonnegative } from "./nonnegative-fit";
import type { SourceKernel } from "./source-kernel";

/**
 * Whether the readings show a point source or only a broad, gentle rise. Gas from a benign source or
 * the store's uneven background spreads over tens of metres and lifts readings a little everywhere; a
 * point kernel fitted to such a rise finds a "best" spot anywhere on it. A leak shows a peak on top of
 * any broad rise. So a spot is judged on how much χ² the point kernel saves over a broad kernel at the
 * same place (nested models: broad alone, broad plus point), not over a flat background.
 */
export interface DiffuseBump {
  /** The broad kernel's value at every reading, for a source at `cell`. */
  column(cell: number): Float64Array;
}

export function diffuseBump(
  grid: PlanGrid,
  stepScale: Float32Array | null,
  readingCell: Int32Array,
  kernel: Pick<SourceKernel, "truncationM" | "at">,
): DiffuseBump {
  const search = new GeodesicSearch(grid, stepScale);
  return {
    column(cell) {
      search.fromCells([cell], kernel.truncationM);
      return Float64Array.from(readingCell, (k) => kernel.at(search.dist[k]));
    },
  };
}

/** A smooth bump with no peak at its centre: a Gaussian of width σ in walking distance, cut at 3σ. */
export function broadKernel(sigmaM: number): Pick<SourceKernel, "truncationM" | "at"> {
  return { truncationM: 3 * sigmaM, at: (d) => (d < 3 * sigmaM ? Math.exp((-0.5 * d * d) / (sigmaM * sigmaM)) : 0) };
}

/** χ² the point column saves over the broad column alone (both fitted with b, Q ≥ 0 to `residual`). */
export function pointOverBroad(
  residual: Float64Array,
  w: Float64Array,
  censored: Uint8Array,
  broad: Float64Array,
  point: Float64Array,
): number {
  const alone = fitNonnegative(residual, w, [broad], censored);
  const both = fitNonnegative(residual, w, [broad, point], censored);
  return alone.chi2 - both.chi2;
}
