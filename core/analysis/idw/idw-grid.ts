/**
 * Shepard's inverse-distance weighting (Shepard 1968, ACM National Conference, p. 517) at the cell
 * centres of a row-major grid: m = Σ w_i·y_i / Σ w_i with w_i = d_i^(−p); a cell centre that coincides
 * with a reading takes that reading's value. Euclidean distance: a plain IDW that ignores walls, kept as
 * the reference the locator's field map is compared against.
 */
export function idwGrid(
  width: number,
  height: number,
  cellSize: number,
  xs: ArrayLike<number>,
  ys: ArrayLike<number>,
  values: ArrayLike<number>,
  power = 2,
): Float64Array {
  if (!(width > 0 && height > 0 && cellSize > 0)) throw new Error("grid width, height and cell size must be positive");
  checkPoints(xs, ys, values);
  const out = new Float64Array(width * height);
  for (let j = 0; j < height; j++) {
    for (let i = 0; i < width; i++)
      out[j * width + i] = idwAt((i + 0.5) * cellSize, (j + 0.5) * cellSize, xs, ys, values, power);
  }
  return out;
}

function checkPoints(xs: ArrayLike<number>, ys: ArrayLike<number>, values: ArrayLike<number>): void {
  if (xs.length !== ys.length || xs.length !== values.length || xs.length === 0) {
    throw new Error("need the same, non-zero number of x, y and values");
  }
}

/** IDW at one point (qx, qy); the value of a coinciding reading when there is one. */
export function idwAt(
  qx: number,
  qy: number,
  xs: ArrayLike<number>,
  ys: ArrayLike<number>,
  values: ArrayLike<number>,
  power = 2,
): number {
  const half = power / 2;
  let sw = 0;
  let swy = 0;
  for (let k = 0; k < xs.length; k++) {
    const d2 = (xs[k] - qx) ** 2 + (ys[k] - qy) ** 2;
    if (d2 === 0) return values[k];
    // p = 2 without a power call (docs/reference/locator-methods.md §2: Math.pow made IDW ten times slower)
    const wgt = half === 1 ? 1 / d2 : 1 / Math.pow(d2, half);
    sw += wgt;
    swy += wgt * values[k];
  }
  return swy / sw;
}
