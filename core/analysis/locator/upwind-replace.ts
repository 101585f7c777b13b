import type { FoundSource } from "./greedy-sources";
import { residualOf } from "./greedy-sources";
import { chooseLocalDrift, type DriftSettings } from "./local-drift";
import { fitNonnegative } from "./nonnegative-fit";
import { kernelColumn, sumWeightedKernelTimes, type ReadingFields } from "./reading-fields";
import { scanSources, scanTotals } from "./source-scan";

/**
 * The first spot placed again near where the greedy fit put it, this time letting each cell take a
 * strong drift. Gas from a leak in a fan-stirred lineup is carried along it by the store's air: the
 * readings rise sharply at the leak's case and stay high for metres downwind, and a kernel with no or a
 * weak drift centres on that stretch, a case or two downwind. A strong drift fits the sharp upwind edge.
 * Tried over the whole store, the strong drift lets a far cell explain a lineup's plume, so it is tried
 * only within `windowM` of the spot, with the other fitted sources and the benign zones held fixed.
 */
export interface UpwindInput {
  /** Reading fields without drift (the field stage's), whose kernel the drifted one replaces cell by cell. */
  fields: ReadingFields;
  y: Float64Array;
  w: Float64Array;
  censored: Uint8Array;
  /** Fixed columns (benign zones, stilled fixtures' levels) fitted with the sources. */
  nuisance: readonly Float64Array[];
  /** Cells a spot may take here (allowed, outside fan-stirred rooms). */
  allowed: Uint8Array;
  prior: Float64Array | null;
  gridWidth: number;
  cellSize: number;
  windowM: number;
  /** The spot moves only when the drifted fit puts it at least this far away, m (nearer, the plain fit's placement stands). */
  minMoveM: number;
  /** ... and only when the drifted fit there beats the best fit without drift in the window by this many times the residual variance. */
  minGain: number;
  /** Other fitted sources keep this distance, m. */
  separationM: number;
  drift: DriftSettings;
}

export function upwindReplace(input: UpwindInput, found: readonly FoundSource[]): FoundSource[] {
  const out = found.slice();
  const k = out.findIndex((s) => !s.alternate);
  if (k !== 0) return out;
  const { fields, y, w, censored } = input;
  const n = y.length;
  const cells = fields.sumWG.length;
  const others = [...input.nuisance, ...out.filter((s, j) => j !== k && !s.alternate).map((s) => s.column)];
  const residual = residualOf(y, others, fitNonnegative(y, w, others, censored).q);
  const window = new Uint8Array(cells);
  const r2 = (input.windowM / input.cellSize) ** 2;
  const sep2 = (input.separationM / input.cellSize) ** 2;
  const width = input.gridWidth;
  const d2 = (a: number, b: number) => {
    const ai = a % width,
      bi = b % width;
    return (ai - bi) ** 2 + ((a - ai) / width - (b - bi) / width) ** 2;
  };
  let any = false;
  for (let c = 0; c < cells; c++) {
    if (!input.allowed[c] || d2(c, out[k].cell) > r2) continue;
    if (out.some((s, j) => j !== k && !s.alternate && d2(c, s.cell) < sep2)) continue;
    window[c] = 1;
    any = true;
  }
  if (!any) return out;
  const drifted = chooseLocalDrift(fields, width, input.cellSize, w, residual, window, input.drift).fields;
  const totals = scanTotals(w, residual);
  const sumWGR = sumWeightedKernelTimes(drifted, w, residual, new Float64Array(cells));
  const scan = scanSources(drifted.sumWG, drifted.sumWGG, sumWGR, totals, window);
  let max = 0;
  for (let c = 0; c < cells; c++) if (scan.delta[c] > max) max = scan.delta[c];
  if (!(max > 0)) return out;
  const s2 = Math.max(1, (scan.chi2Background - max) / Math.max(1, n - 2));
  let best = -1;
  let bestScore = -Infinity;
  for (let c = 0; c < cells; c++) {
    if (!(scan.delta[c] > 0)) continue;
    const score = scan.delta[c] + 2 * s2 * (input.prior ? input.prior[c] : 0);
    if (score > bestScore) {
      bestScore = score;
      best = c;
    }
  }
  if (best < 0 || d2(best, out[k].cell) < (input.minMoveM / input.cellSize) ** 2) return out;
  // the drifted fit must beat the best fit without drift in the window, not only its own cell's: a lineup's
  // plume spread evenly both ways (air curtains, no drift) is fitted a little better by any wider shape
  const plainSums = sumWeightedKernelTimes(fields, w, residual, new Float64Array(cells));
  const plain = scanSources(fields.sumWG, fields.sumWGG, plainSums, totals, window);
  let plainMax = 0;
  for (let c = 0; c < cells; c++) if (plain.delta[c] > plainMax) plainMax = plain.delta[c];
  if (scan.delta[best] - plainMax < input.minGain * s2) return out;
  out[k] = {
    ...out[k],
    cell: best,
    delta: scan.delta[best],
    column: kernelColumn(drifted, best, n),
    surface: scan.delta,
  };
  return out;
}
