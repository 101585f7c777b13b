import { fitNonnegative, type NonnegativeFit } from "./nonnegative-fit";
import { kernelColumn, sumWeightedKernelTimes, type ReadingFields } from "./reading-fields";
import { localOptima, scanSources, scanTotals, type ScanResult } from "./source-scan";

export interface FoundSource {
  cell: number;
  /** Δχ² of this source when it was picked. */
  delta: number;
  /** Kernel value of every reading seen from this source. */
  column: Float64Array;
  /** True for an alternative spot of the first scan (e.g. the other side of a pass), not a fitted source. */
  alternate: boolean;
  /** A spot from one strong reading that no fitted source explains (pipeline/one-reading.ts). */
  oneReading?: boolean;
  q: number;
  /** The Δχ² map this spot was chosen on (its own round's scan), for refinement and radius. */
  surface: Float64Array;
}

export interface GreedyInput {
  fields: ReadingFields;
  y: Float64Array;
  w: Float64Array;
  censored: Uint8Array;
  /** Fixed-position nuisance sources (benign-source zones), fitted with free Q ≥ 0 and never listed. */
  nuisance: Float64Array[];
  allowed: Uint8Array;
  gridWidth: number;
  cellSize: number;
  maxLeaks: number;
  maxCandidates: number;
  separationM: number;
  alternateFraction: number;
  /** Per-cell log prior odds of a leak (0 = neutral), weighed against Δχ² in units of the residual variance. */
  prior: Float64Array | null;
  /** Fitted sources are at least this far apart, m; each is moved at most this far by the joint relocation. */
  sourceSeparationM: number;
  /** Sources of the rounds after these are listed after the independent spots of these rounds. */
  rankedRounds: number;
  /** Fitted sources within this distance of a stronger one are listed after the others, m (0 = off). */
  tailReachM: number;
  credible: (
    cell: number,
    column: Float64Array,
    q: number,
    b: number,
    residual: Float64Array,
    delta: number,
    /** Sources fitted before this one (0: whether there is any leak at all). */
    fitted: number,
  ) => boolean;
}

export interface GreedyResult {
  sources: FoundSource[];
  fit: NonnegativeFit;
  firstScan: ScanResult;
  /** χ² of the final joint fit. */
  chi2Final: number;
}

/**
 * The cell maximising Δχ² + 2·s²·log-prior, with s² the residual variance of the best single-source fit
 * (so the prior counts as much as it would against data of that scatter); -1 when no cell fits.
 */
function bestWithPrior(scan: ScanResult, prior: Float64Array | null, n: number): number {
  let best = -1;
  let max = 0;
  const from = scan.from ?? 0;
  const to = scan.to ?? scan.delta.length;
  for (let c = from; c < to; c++)
    if (scan.delta[c] > max) {
      max = scan.delta[c];
      best = c;
    }
  if (best < 0 || !prior) return best;
  const s2 = Math.max(1, (scan.chi2Background - max) / Math.max(1, n - 2));
  let bestScore = -Infinity;
  for (let c = from; c < to; c++) {
    if (!(scan.delta[c] > 0)) continue;
    const score = scan.delta[c] + 2 * s2 * prior[c];
    if (score > bestScore) {
      bestScore = score;
      best = c;
    }
  }
  return best;
}

/** Calls visit(k) for every cell k within radiusM of cell c on a row-major grid `width` wide. */
function forEachCellWithin(
  c: number,
  width: number,
  height: number,
  cellSize: number,
  radiusM: number,
  visit: (k: number) => void,
): void {
  const r = Math.ceil(radiusM / cellSize);
  const ci = c % width;
  const cj = (c - ci) / width;
  for (let j = Math.max(0, cj - r); j <= Math.min(height - 1, cj + r); j++) {
    for (let i = Math.max(0, ci - r); i <= Math.min(width - 1, ci + r); i++) {
      if ((i - ci) ** 2 + (j - cj) ** 2 <= r * r) visit(j * width + i);
    }
  }
}

function blockAround(mask: Uint8Array, c: number, width: number, cellSize: number, radiusM: number): void {
  forEachCellWithin(c, width, mask.length / width, cellSize, radiusM, (k) => (mask[k] = 0));
}

function cellDist2(a: number, b: number, width: number): number {
  const ai = a % width,
    bi = b % width;
  return (ai - bi) ** 2 + ((a - ai) / width - (b - bi) / width) ** 2;
}

/** The readings minus every column's fitted share (columns with no strength are skipped). */
export function residualOf(y: Float64Array, columns: readonly Float64Array[], q: readonly number[]): Float64Array {
  const r = new Float64Array(y);
  columns.forEach((col, s) => {
    if (q[s] > 0) for (let i = 0; i < r.length; i++) r[i] -= q[s] * col[i];
  });
  return r;
}

/**
 * Each fitted source moved, one at a time, to the best cell within `sourceSeparationM` of it against the
 * readings minus the other sources' joint fit (kept `sourceSeparationM` away from them). The greedy step
 * places a source while a second leak's gas is still unexplained, which pulls it towards that leak;
 * with the other source fitted the pull is gone. One pass: a second one changed no measured figure.
 */
export function relocateSources(
  input: Pick<
    GreedyInput,
    | "fields"
    | "y"
    | "w"
    | "censored"
    | "nuisance"
    | "allowed"
    | "gridWidth"
    | "cellSize"
    | "sourceSeparationM"
    | "prior"
  >,
  found: readonly FoundSource[],
  fit: NonnegativeFit,
): { sources: FoundSource[]; fit: NonnegativeFit } {
  const { fields, y, w, censored, allowed } = input;
  const n = y.length;
  const cells = fields.sumWG.length;
  const nn = input.nuisance.length;
  const sources = found.slice();
  const columns = [...input.nuisance, ...sources.map((s) => s.column)];
  const sumWGR = new Float64Array(cells);
  for (let k = 0; k < sources.length; k++) {
    const others = columns.filter((_, j) => j !== nn + k);
    const residual = residualOf(y, others, fitNonnegative(y, w, others, censored).q);
    const totals = scanTotals(w, residual);
    sumWeightedKernelTimes(fields, w, residual, sumWGR);
    const near = new Uint8Array(cells);
    const height = cells / input.gridWidth;
    forEachCellWithin(sources[k].cell, input.gridWidth, height, input.cellSize, input.sourceSeparationM, (c) => {
      near[c] = allowed[c];
    });
    sources.forEach((o, j) => {
      if (j !== k) blockAround(near, o.cell, input.gridWidth, input.cellSize, input.sourceSeparationM);
    });
    const scan = scanSources(fields.sumWG, fields.sumWGG, sumWGR, totals, near);
    const best = bestWithPrior(scan, input.prior, n);
    if (best < 0 || best === sources[k].cell) continue;
    const column = kernelColumn(fields, best, n);
    sources[k] = { cell: best, delta: scan.delta[best], column, alternate: false, q: 0, surface: scan.delta };
    columns[nn + k] = column;
    fit = fitNonnegative(y, w, columns, censored);
  }
  return { sources, fit };
}

/** The highest reading a source's fitted share explains, ppm: q·g at the reading it reaches most. */
export function explainedPeak(s: Pick<FoundSource, "q" | "column">): number {
  let m = 0;
  for (let i = 0; i < s.column.length; i++) m = Math.max(m, s.q * s.column[i]);
  return m;
}

/**
 * Fitted sources in list order (their strengths `q` from the final joint fit). First the strongest
 * source of the first `rankedRounds` rounds: a weak source the greedy step picked early usually mops up
 * far-field gas of a strong one that the truncated kernel cannot reach. After it, each by its own
 * evidence: the highest reading its share explains. A source that mops up the shoulders of a shared
 * plume explains a little of many readings, a second leak most of its own peak; by strength alone (q,
 * the excess at the kernel's cut-off, extrapolated where no reading is close) the mop-ups often came
 * first (docs/locator/benchmark-baseline.md, "Sixth round").
 */
export function orderFitted(sources: readonly FoundSource[], rankedRounds: number): FoundSource[] {
  if (sources.length === 0) return [];
  const ranked = sources.slice(0, rankedRounds);
  const first = ranked.reduce((a, b) => (b.q > a.q ? b : a));
  const peak = new Map(sources.map((s) => [s, explainedPeak(s)]));
  const rest = sources.filter((s) => s !== first).sort((a, b) => peak.get(b)! - peak.get(a)!);
  return [first, ...rest];
}

/**
 * Several leaks by greedy forward selection (in the spirit of Yee 2012): scan all cells against the
 * residual of the current joint fit, take the best credible cell, refit all strengths jointly, repeat
 * until no credible cell is left. The first scan's other local optima become alternatives.
 */
export function findSources(input: GreedyInput): GreedyResult {
  const { fields, y, w, censored, allowed } = input;
  const n = y.length;
  const cells = fields.sumWG.length;
  const columns = input.nuisance.slice();
  let fit = fitNonnegative(y, w, columns, censored);
  const sources: FoundSource[] = [];
  const sumWGR = new Float64Array(cells);
  let firstScan: ScanResult | null = null;
  const roundAllowed = new Uint8Array(allowed);
  for (let round = 0; round < input.maxLeaks; round++) {
    const residual = residualOf(y, columns, fit.q);
    const totals = scanTotals(w, residual);
    sumWeightedKernelTimes(fields, w, residual, sumWGR);
    const scan = scanSources(fields.sumWG, fields.sumWGG, sumWGR, totals, roundAllowed);
    if (!firstScan) firstScan = scan;
    let best = bestWithPrior(scan, input.prior, n);
    if (best < 0) break;
    let column = kernelColumn(fields, best, n);
    // Whether there is a leak at all is the readings' question: the best-fitting cell must be credible
    // on its own; the prior only chooses where, among cells the readings allow.
    const ml = input.prior ? bestWithPrior(scan, null, n) : best;
    const mlColumn = ml === best ? column : kernelColumn(fields, ml, n);
    if (!input.credible(ml, mlColumn, scan.q[ml], scan.b[ml], residual, scan.delta[ml], sources.length)) break;
    if (
      ml !== best &&
      !input.credible(best, column, scan.q[best], scan.b[best], residual, scan.delta[best], sources.length)
    ) {
      best = ml;
      column = mlColumn;
    }
    columns.push(column);
    fit = fitNonnegative(y, w, columns, censored);
    sources.push({ cell: best, delta: scan.delta[best], column, alternate: false, q: 0, surface: scan.delta });
    // A second source right beside the first mostly patches the kernel's misfit there, not a leak.
    blockAround(roundAllowed, best, input.gridWidth, input.cellSize, input.sourceSeparationM);
  }
  if (sources.length > 0) {
    const moved = relocateSources(input, sources, fit);
    sources.splice(0, sources.length, ...moved.sources);
    fit = moved.fit;
  }
  const nn = input.nuisance.length;
  sources.forEach((s, k) => (s.q = fit.q[nn + k]));
  const bestDelta = Math.max(0, ...sources.map((s) => s.delta));
  sources.splice(0, sources.length, ...orderFitted(sources, input.rankedRounds));
  if (firstScan && sources.length > 0 && sources.length < input.maxCandidates) {
    const sep2 = (input.separationM / input.cellSize) ** 2;
    const near = (a: number, b: number) => {
      const ai = a % input.gridWidth,
        bi = b % input.gridWidth;
      return (ai - bi) ** 2 + ((a - ai) / input.gridWidth - (b - bi) / input.gridWidth) ** 2 < sep2;
    };
    const optima = localOptima(
      firstScan.delta,
      input.gridWidth,
      input.cellSize,
      input.separationM,
      16,
      input.alternateFraction * bestDelta,
    );
    const residual0 = residualOf(y, input.nuisance, fit.q);
    for (const c of optima) {
      if (sources.length >= input.maxCandidates) break;
      if (sources.some((s) => near(s.cell, c))) continue;
      const column = kernelColumn(fields, c, n);
      if (!input.credible(c, column, firstScan.q[c], firstScan.b[c], residual0, firstScan.delta[c], sources.length))
        continue;
      sources.push({
        cell: c,
        delta: firstScan.delta[c],
        column,
        alternate: true,
        q: firstScan.q[c],
        surface: firstScan.delta,
      });
    }
  }
  if (input.tailReachM > 0) {
    // A weaker fitted source within a stronger one's reach may be its far-field tail (which the
    // truncated kernel cannot model) as much as a second leak: list it after the independent spots.
    const reach2 = (input.tailReachM / input.cellSize) ** 2;
    const fitted = sources.filter((x) => !x.alternate);
    const tail = new Set(
      fitted.filter((x, k) => fitted.slice(0, k).some((st) => cellDist2(st.cell, x.cell, input.gridWidth) < reach2)),
    );
    const head = sources.filter((x) => !tail.has(x));
    sources.splice(0, sources.length, ...head, ...sources.filter((x) => tail.has(x)));
  }
  return {
    sources,
    fit,
    firstScan: firstScan ?? {
      delta: new Float64Array(cells),
      q: new Float64Array(cells),
      b: new Float64Array(cells),
      chi2Background: 0,
    },
    chi2Final: fit.chi2,
  };
}
