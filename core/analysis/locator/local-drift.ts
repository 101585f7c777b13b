import type { ReadingFields } from "./reading-fields";
import { backgroundChi2, fitOneCell, type ScanTotals } from "./source-scan";
import { besselK0 } from "./bessel-k0";
import { createSourceKernel, type SourceKernel } from "./source-kernel";

/**
 * A weak drift carries a leak's gas downwind. The steady 2-D advection–diffusion equation with
 * first-order removal, K∇²C − u·∇C − λC = −Qδ, has the point-source solution
 *   C(r) = Q/(2πK) · exp(u·r/(2K)) · K0(|r|·√(|u|²/(4K²) + λ/K))
 * (the substitution C = exp(u·r/(2K))·φ turns it into the screened equation whose point solution is
 * K0; the moving-point-source form of Carslaw & Jaeger, Conduction of Heat in Solids, from memory, and
 * checked against the equation by finite differences in local-drift.test.ts). With a = u/(2K) (1/m) and L = √(K/λ): g = exp(a·r)·K0(|r|·√(|a|² + 1/L²)).
 * Only a is identifiable, not u and K apart.
 *
 * The drift in a store follows its supply diffusers and return grilles, so it differs from aisle to
 * aisle: each candidate source cell takes its own drift, the one among a few directions and strengths
 * that fits the readings best, and only when it beats no drift by `penalty` times the residual
 * variance (two more parameters per source). |r| stays the obstacle-aware distance; the direction
 * term a·r uses the straight displacement, which is never longer than that distance.
 */
/** Unit vectors of the eight drift directions tried: east, then every 45° (+y is down the plan). */
export const DRIFT_DIRECTIONS: ReadonlyArray<[number, number]> = Array.from({ length: 8 }, (_, k) => [
  Math.round(Math.cos((k * Math.PI) / 4) * 1e12) / 1e12,
  Math.round(Math.sin((k * Math.PI) / 4) * 1e12) / 1e12,
]);

export interface DriftSettings {
  screeningLengthM: number;
  /** The kernel's far-field part (source-kernel.ts), null = none. */
  far?: { lengthM: number; share: number } | null;
  nearCutoffM: number;
  truncationM: number;
  /** Drift strengths |a| tried, 1/m. */
  strengths: readonly number[];
  /** A drift must beat none by this many times the residual variance. */
  penalty: number;
}

/**
 * The drifted kernel: g(d, Δ) = K0 table at √(|a|² + 1/L²) times exp(a·Δ), Δ = reading − source,
 * on the no-drift kernel's scale (its value at the near cut-off), so strengths of sources with and
 * without drift compare as emission rates at the same K.
 */
export function driftedKernel(
  screeningLengthM: number,
  nearCutoffM: number,
  truncationM: number,
  a: readonly [number, number],
  far: { lengthM: number; share: number } | null = null,
) {
  const { table, scale } = radialPart(screeningLengthM, nearCutoffM, truncationM, Math.hypot(a[0], a[1]), far);
  return (d: number, dx: number, dy: number) => scale * table.at(d) * Math.exp(a[0] * dx + a[1] * dy);
}

function radialPart(
  screeningLengthM: number,
  nearCutoffM: number,
  truncationM: number,
  strength: number,
  far: { lengthM: number; share: number } | null = null,
): { table: SourceKernel; scale: number } {
  const rate = (L: number) => Math.sqrt(strength * strength + 1 / (L * L));
  const kappa = rate(screeningLengthM);
  const table = createSourceKernel(
    1 / kappa,
    nearCutoffM,
    truncationM,
    far ? { lengthM: 1 / rate(far.lengthM), share: far.share } : null,
  );
  const span = (k: number) => besselK0(nearCutoffM * k) - besselK0(truncationM * k);
  return { table, scale: span(kappa) / span(1 / screeningLengthM) };
}

/**
 * Chooses each cell's drift against the residual r (readings minus nuisance sources) and returns new
 * fields whose kernel values and per-cell sums use the chosen kernel, so every later step (scan, joint
 * fit, columns) uses it; the fields given are left as they were. They must be built with the same
 * screening lengths (cells left without drift keep the kernel they were built with).
 * Also returns per cell the chosen strength index + 1 and direction (0 = no drift).
 *
 * Only the allowed cells can take a drift, so the drifted sums are kept for them alone, in one compact
 * slot per allowed cell (a retry screen allows a few thousand of a plan's 100,000 cells). Each cell's
 * sums add the same terms in the same order as a sum over every cell would, so the choice is the same.
 */
export function chooseLocalDrift(
  fields: ReadingFields,
  gridWidth: number,
  cellSize: number,
  w: Float64Array,
  r: Float64Array,
  allowed: Uint8Array,
  settings: DriftSettings,
): { fields: ReadingFields; strength: Uint8Array; direction: Uint8Array } {
  if (!(settings.penalty >= 0)) throw new Error(`drift penalty must be >= 0, got ${settings.penalty}`);
  for (const v of settings.strengths) if (!(v > 0)) throw new Error(`drift strength must be positive, got ${v}`);
  const cells = fields.sumWG.length;
  const n = r.length;
  // each long loop is a small function of its own, so the JIT optimises it on its own and no code after
  // it throws the optimised loop away (docs/decisions/0147)
  const { gw, gwr, totals } = groupTotals(fields.groupOfReading, fields.groupCell.length, w, r);
  const chi0 = backgroundChi2(totals);
  const slots = allowedSlots(fields, gridWidth, cellSize, allowed);
  const far = settings.far ?? null;
  const radial = settings.strengths.map((v) =>
    radialPart(settings.screeningLengthM, settings.nearCutoffM, settings.truncationM, v, far),
  );

  // no drift: the fit every drift must beat
  const best = noDriftFit(fields, slots, gwr, totals, chi0);
  let max = 0;
  for (let s = 0; s < slots.count; s++) max = Math.max(max, best[s]);
  const bar = settings.penalty * Math.max(1, (chi0 - max) / Math.max(1, n - 2));
  for (let s = 0; s < slots.count; s++) best[s] += bar;
  const slotStrength = new Uint8Array(slots.count);
  const slotDirection = new Uint8Array(slots.count);

  // the sums of direction k for slot s at [s·8 + k]
  const D = DRIFT_DIRECTIONS.length;
  const sG = new Float64Array(slots.count * D);
  const sGG = new Float64Array(slots.count * D);
  const sGR = new Float64Array(slots.count * D);
  for (let si = 0; si < radial.length; si++) {
    sG.fill(0);
    sGG.fill(0);
    sGR.fill(0);
    addDriftSums(fields.dist, slots, gw, gwr, radial[si], settings.strengths[si], sG, sGG, sGR);
    chooseDirections(sG, sGG, sGR, slots.count, totals, chi0, si, best, slotStrength, slotDirection);
  }
  const strength = new Uint8Array(cells);
  const direction = new Uint8Array(cells);
  for (let s = 0; s < slots.count; s++) {
    strength[slots.cell[s]] = slotStrength[s];
    direction[slots.cell[s]] = slotDirection[s];
  }
  const kernel = driftedKernelValues(fields, slots, radial, settings.strengths, slotStrength, slotDirection);
  const { sumWG, sumWGG } = kernelSums(fields, gw, kernel, cells);
  return { fields: { ...fields, kernel, sumWG, sumWGG }, strength, direction };
}

/** Per group Σ w and Σ w·r, and the totals Σ w, Σ w·r, Σ w·r² over every reading. */
function groupTotals(
  groupOfReading: Int32Array,
  groups: number,
  w: Float64Array,
  r: Float64Array,
): { gw: Float64Array; gwr: Float64Array; totals: ScanTotals } {
  const gw = new Float64Array(groups);
  const gwr = new Float64Array(groups);
  let sw = 0,
    swr = 0,
    swrr = 0;
  for (let i = 0; i < r.length; i++) {
    gw[groupOfReading[i]] += w[i];
    gwr[groupOfReading[i]] += w[i] * r[i];
    sw += w[i];
    swr += w[i] * r[i];
    swrr += w[i] * r[i] * r[i];
  }
  return { gw, gwr, totals: { sumW: sw, sumWR: swr, sumWRR: swrr } };
}

/** The allowed cells' slots, and the entries that reach them, group by group as stored. */
interface Slots {
  readonly count: number;
  /** The cell of each slot. */
  readonly cell: Int32Array;
  /** Per listed entry: its index in the fields, its slot, the straight displacement reading − cell. */
  readonly entry: Int32Array;
  readonly slot: Int32Array;
  readonly dxs: Float32Array;
  readonly dys: Float32Array;
  /** The listed entries of group g are [entryStart[g], entryStart[g + 1]). */
  readonly entryStart: Int32Array;
  readonly entries: number;
}

function allowedSlots(fields: ReadingFields, gridWidth: number, cellSize: number, allowed: Uint8Array): Slots {
  const { start, cell, groupX, groupY } = fields;
  const groups = fields.groupCell.length;
  const slotOf = new Int32Array(fields.sumWG.length).fill(-1);
  const slotCell: number[] = [];
  let reaching = 0;
  for (let e = 0; e < cell.length; e++) {
    const c = cell[e];
    if (!allowed[c]) continue;
    reaching++;
    if (slotOf[c] < 0) {
      slotOf[c] = slotCell.length;
      slotCell.push(c);
    }
  }
  const entry = new Int32Array(reaching);
  const slot = new Int32Array(reaching);
  const entryStart = new Int32Array(groups + 1);
  // the straight displacement reading − cell, stored as the kernel's entries are (single precision)
  const dxs = new Float32Array(reaching);
  const dys = new Float32Array(reaching);
  let m = 0;
  for (let g = 0; g < groups; g++) {
    entryStart[g] = m;
    for (let e = start[g], end = start[g + 1]; e < end; e++) {
      const c = cell[e];
      const s = slotOf[c];
      if (s < 0) continue;
      const ci = c % gridWidth;
      entry[m] = e;
      slot[m] = s;
      dxs[m] = groupX[g] - (ci + 0.5) * cellSize;
      dys[m] = groupY[g] - ((c - ci) / gridWidth + 0.5) * cellSize;
      m++;
    }
  }
  entryStart[groups] = m;
  return { count: slotCell.length, cell: Int32Array.from(slotCell), entry, slot, dxs, dys, entryStart, entries: m };
}

/** Each slot's Δχ² with the kernel the fields were built with. */
function noDriftFit(
  fields: ReadingFields,
  slots: Slots,
  gwr: Float64Array,
  totals: ScanTotals,
  chi0: number,
): Float64Array {
  const { entry, slot, entryStart } = slots;
  const sumGR = new Float64Array(slots.count);
  for (let g = 0; g < gwr.length; g++) {
    const ar = gwr[g];
    for (let k = entryStart[g]; k < entryStart[g + 1]; k++) sumGR[slot[k]] += ar * fields.kernel[entry[k]];
  }
  const best = new Float64Array(slots.count);
  for (let s = 0; s < slots.count; s++) {
    const c = slots.cell[s];
    best[s] = fitOneCell(fields.sumWG[c], fields.sumWGG[c], sumGR[s], totals, chi0);
  }
  return best;
}

/** The eight directions' sums of one strength in one pass: exp(a·Δ) from four exponentials per entry. */
function addDriftSums(
  dist: Float32Array,
  slots: Slots,
  gw: Float64Array,
  gwr: Float64Array,
  { table, scale }: { table: SourceKernel; scale: number },
  a: number,
  sG: Float64Array,
  sGG: Float64Array,
  sGR: Float64Array,
): void {
  const { entry, slot, dxs, dys, entryStart } = slots;
  const D = DRIFT_DIRECTIONS.length;
  const f = new Float64Array(D);
  const h = Math.SQRT1_2;
  for (let g = 0; g < gw.length; g++) {
    const aw = gw[g],
      ar = gwr[g];
    for (let k = entryStart[g]; k < entryStart[g + 1]; k++) {
      const t = scale * table.at(dist[entry[k]]);
      const ex = Math.exp(a * dxs[k]),
        ey = Math.exp(a * dys[k]);
      const hx = Math.exp(a * h * dxs[k]),
        hy = Math.exp(a * h * dys[k]);
      f[0] = t * ex;
      f[1] = t * hx * hy;
      f[2] = t * ey;
      f[3] = (t * hy) / hx;
      f[4] = t / ex;
      f[5] = t / (hx * hy);
      f[6] = t / ey;
      f[7] = (t * hx) / hy;
      const o = slot[k] * D;
      for (let d = 0; d < D; d++) {
        const v = f[d];
        sG[o + d] += aw * v;
        sGG[o + d] += aw * v * v;
        sGR[o + d] += ar * v;
      }
    }
  }
}

/** Directions in order within a strength, as the choice breaks ties towards the first tried. */
function chooseDirections(
  sG: Float64Array,
  sGG: Float64Array,
  sGR: Float64Array,
  slots: number,
  totals: ScanTotals,
  chi0: number,
  si: number,
  best: Float64Array,
  slotStrength: Uint8Array,
  slotDirection: Uint8Array,
): void {
  const D = DRIFT_DIRECTIONS.length;
  for (let s = 0; s < slots; s++) {
    const o = s * D;
    for (let d = 0; d < D; d++) {
      const delta = fitOneCell(sG[o + d], sGG[o + d], sGR[o + d], totals, chi0);
      if (delta > best[s]) {
        best[s] = delta;
        slotStrength[s] = si + 1;
        slotDirection[s] = d;
      }
    }
  }
}

/** The fields' kernel values with each drifted slot's chosen kernel in place of the plain one. */
function driftedKernelValues(
  fields: ReadingFields,
  slots: Slots,
  radial: readonly { table: SourceKernel; scale: number }[],
  strengths: readonly number[],
  slotStrength: Uint8Array,
  slotDirection: Uint8Array,
): Float32Array {
  const { entry, slot, dxs, dys } = slots;
  const { dist } = fields;
  const kernel = Float32Array.from(fields.kernel);
  for (let k = 0; k < slots.entries; k++) {
    const si = slotStrength[slot[k]];
    if (si === 0) continue;
    const a = strengths[si - 1];
    const [ux, uy] = DRIFT_DIRECTIONS[slotDirection[slot[k]]];
    const e = entry[k];
    kernel[e] = radial[si - 1].scale * radial[si - 1].table.at(dist[e]) * Math.exp(a * (ux * dxs[k] + uy * dys[k]));
  }
  return kernel;
}

/** Per cell Σ w·g and Σ w·g² with the given kernel values. */
function kernelSums(
  fields: ReadingFields,
  gw: Float64Array,
  kernel: Float32Array,
  cells: number,
): { sumWG: Float64Array; sumWGG: Float64Array } {
  const { start, cell } = fields;
  const sumWG = new Float64Array(cells);
  const sumWGG = new Float64Array(cells);
  for (let g = 0; g < gw.length; g++) {
    const aw = gw[g];
    for (let e = start[g], end = start[g + 1]; e < end; e++) {
      const c = cell[e];
      sumWG[c] += aw * kernel[e];
      sumWGG[c] += aw * kernel[e] * kernel[e];
    }
  }
  return { sumWG, sumWGG };
}
