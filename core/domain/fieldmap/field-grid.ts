/** A concentration field on a regular grid over the plan, row-major (values[y * width + x]). */
export interface FieldGridLike {
  width: number;
  height: number;
  /** Metres per cell; cell (i, j) covers [i·cellSize, (i+1)·cellSize) × [j·cellSize, (j+1)·cellSize). */
  cellSize: number;
  /** ppm; NaN where nothing is known. */
  values: Float32Array;
  /** 0..1 sampling confidence. */
  confidence: Float32Array;
}

export function checkFieldGrid(grid: FieldGridLike, name = "field"): void {
  const { width, height, cellSize, values, confidence } = grid;
  if (!(Number.isInteger(width) && width > 0 && Number.isInteger(height) && height > 0)) {
    throw new RangeError(`${name}: width and height must be positive whole numbers of cells, got ${width} × ${height}`);
  }
  if (!(cellSize > 0)) throw new RangeError(`${name}.cellSize: must be a positive number of metres, got ${cellSize}`);
  if (values.length !== width * height)
    throw new RangeError(`${name}.values: expected ${width * height} cells, got ${values.length}`);
  if (confidence.length !== width * height)
    throw new RangeError(`${name}.confidence: expected ${width * height} cells, got ${confidence.length}`);
}

/** Below this confidence a cell is unknown: drawn hatched, never as clean air. */
export const UNKNOWN_BELOW = 0.15;
/** From UNKNOWN_BELOW up to this, the colour is faded in proportion to the confidence. */
export const FULL_CONFIDENCE = 0.6;

export function isKnown(grid: FieldGridLike, k: number): boolean {
  return Number.isFinite(grid.values[k]) && grid.confidence[k] >= UNKNOWN_BELOW;
}
