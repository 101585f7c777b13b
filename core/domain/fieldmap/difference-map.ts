/**
 * Later minus earlier, on the later sweep's grid. The earlier field is sampled (nearest cell) at the
 * point the stored alignment between the plan versions maps each later cell centre back to; a cell is
 * unknown (NaN, confidence 0) when either sweep did not sample it.
 */
import { applySimilarity, invertSimilarity, type Similarity } from "../../analysis/geometry/similarity";
import { checkFieldGrid, isKnown, type FieldGridLike } from "./field-grid";

export interface DifferenceGrid extends FieldGridLike {
  /** Largest |difference| over known cells (0 when none differ). */
  maxAbs: number;
}

/** Index of the cell holding plan point (x, y), or -1 outside the grid. */
export function cellAt(grid: FieldGridLike, x: number, y: number): number {
  const i = Math.floor(x / grid.cellSize);
  const j = Math.floor(y / grid.cellSize);
  if (i < 0 || j < 0 || i >= grid.width || j >= grid.height) return -1;
  return j * grid.width + i;
}

/**
 * @param earlierToLater maps the earlier sweep's plan metres onto the later sweep's (the composed
 *   alignments of the versions in between; identity for the same plan version).
 */
export function differenceMap(
  earlier: FieldGridLike,
  later: FieldGridLike,
  earlierToLater: Similarity,
): DifferenceGrid {
  checkFieldGrid(earlier, "earlier");
  checkFieldGrid(later, "later");
  const back = invertSimilarity(earlierToLater);
  const { width, height, cellSize } = later;
  const values = new Float32Array(width * height).fill(NaN);
  const confidence = new Float32Array(width * height);
  let maxAbs = 0;
  for (let j = 0; j < height; j++) {
    for (let i = 0; i < width; i++) {
      const k = j * width + i;
      if (!isKnown(later, k)) continue;
      const [ex, ey] = applySimilarity(back, [(i + 0.5) * cellSize, (j + 0.5) * cellSize]);
      const e = cellAt(earlier, ex, ey);
      if (e < 0 || !isKnown(earlier, e)) continue;
      const d = later.values[k] - earlier.values[e];
      values[k] = d;
      confidence[k] = Math.min(later.confidence[k], earlier.confidence[e]);
      if (Math.abs(d) > maxAbs) maxAbs = Math.abs(d);
    }
  }
  return { width, height, cellSize, values, confidence, maxAbs };
}
