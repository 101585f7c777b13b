import type { ReadingFields } from "./reading-fields";
import { scanSources, type ScanTotals } from "./source-scan";
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
  const { dist, start, cell, groupX, groupY, groupOfReading } = fields;
  if (!(settings.penalty >= 0)) throw new Error(`drift penalty must be >= 0, got ${settings.penalty}`);
  for (const v of settings.strengths) if (!(v > 0)) throw new Error(`drift strength must be positive, got ${v}`);
  const cells = fields.sumWG.length;
  const groups = fields.groupCell.length;
  const n = r.length;
  const gw = new Float64Array(groups);
  const gwr = new Float64Array(groups);
  let sw = 0,
    swr = 0,
    swrr = 0;
  for (let i = 0; i < n; i++) {
    gw[groupOfReading[i]] += w[i];
    gwr[groupOfReading[i]] += w[i] * r[i];
    sw += w[i];
    swr += w[i] * r[i];
    swrr += w[i] * r[i] * r[i];
  }
  const totals: ScanTotals = { sumW: sw, sumWR: swr, sumWRR: swrr };
  const entries = cell.length;
  const dxs = new Float32Array(entries);
  const dys = new Float32Array(entries);
  for (let g = 0; g < groups; g++) {
    for (let e = start[g], end = start[g + 1]; e < end; e++) {
      const c = cell[e];
      const ci = c % gridWidth;
      dxs[e] = groupX[g] - (ci + 0.5) * cellSize;
      dys[e] = groupY[g] - ((c - ci) / gridWidth + 0.5) * cellSize;
    }
  }
  const far = settings.far ?? null;
  const radial = settings.strengths.map((v) =>
    radialPart(settings.screeningLengthM, settings.nearCutoffM, settings.truncationM, v, far),
  );

  // no drift: the scan every drift must beat
  const sumWGR = new Float64Array(cells);
  for (let g = 0; g < groups; g++) {
    const ar = gwr[g];
    for (let e = start[g], end = start[g + 1]; e < end; e++) sumWGR[cell[e]] += ar * fields.kernel[e];
  }
  const scan0 = scanSources(fields.sumWG, fields.sumWGG, sumWGR, totals, allowed);
  const best = Float64Array.from(scan0.delta);
  let max = 0;
  for (let c = 0; c < cells; c++) max = Math.max(max, best[c]);
  const bar = settings.penalty * Math.max(1, (scan0.chi2Background - max) / Math.max(1, n - 2));
  for (let c = 0; c < cells; c++) best[c] += bar;
  const strength = new Uint8Array(cells);
  const direction = new Uint8Array(cells);

  // eight directions per strength in one pass: exp(a·Δ) from four exponentials per entry
  const D = DRIFT_DIRECTIONS.length;
  const sG = Array.from({ length: D }, () => new Float64Array(cells));
  const sGG = Array.from({ length: D }, () => new Float64Array(cells));
  const sGR = Array.from({ length: D }, () => new Float64Array(cells));
  const f = new Float64Array(D);
  const h = Math.SQRT1_2;
  radial.forEach(({ table, scale }, si) => {
    const a = settings.strengths[si];
    for (let k = 0; k < D; k++) {
      sG[k].fill(0);
      sGG[k].fill(0);
      sGR[k].fill(0);
    }
    for (let g = 0; g < groups; g++) {
      const aw = gw[g],
        ar = gwr[g];
      for (let e = start[g], end = start[g + 1]; e < end; e++) {
        const c = cell[e];
        if (!allowed[c]) continue; // only cells that may hold a suspect spot need a drift
        const t = scale * table.at(dist[e]);
        const ex = Math.exp(a * dxs[e]),
          ey = Math.exp(a * dys[e]);
        const hx = Math.exp(a * h * dxs[e]),
          hy = Math.exp(a * h * dys[e]);
        f[0] = t * ex;
        f[1] = t * hx * hy;
        f[2] = t * ey;
        f[3] = (t * hy) / hx;
        f[4] = t / ex;
        f[5] = t / (hx * hy);
        f[6] = t / ey;
        f[7] = (t * hx) / hy;
        for (let k = 0; k < D; k++) {
          const v = f[k];
          sG[k][c] += aw * v;
          sGG[k][c] += aw * v * v;
          sGR[k][c] += ar * v;
        }
      }
    }
    for (let k = 0; k < D; k++) {
      const scan = scanSources(sG[k], sGG[k], sGR[k], totals, allowed);
      for (let c = 0; c < cells; c++) {
        if (scan.delta[c] > best[c]) {
          best[c] = scan.delta[c];
          strength[c] = si + 1;
          direction[c] = k;
        }
      }
    }
  });

  // the chosen kernel, in new fields
  const kernel = Float32Array.from(fields.kernel);
  const sumWG = new Float64Array(cells);
  const sumWGG = new Float64Array(cells);
  for (let g = 0; g < groups; g++) {
    const aw = gw[g];
    for (let e = start[g], end = start[g + 1]; e < end; e++) {
      const c = cell[e];
      const si = strength[c];
      if (si > 0) {
        const a = settings.strengths[si - 1];
        const [ux, uy] = DRIFT_DIRECTIONS[direction[c]];
        kernel[e] = radial[si - 1].scale * radial[si - 1].table.at(dist[e]) * Math.exp(a * (ux * dxs[e] + uy * dys[e]));
      }
      sumWG[c] += aw * kernel[e];
      sumWGG[c] += aw * kernel[e] * kernel[e];
    }
  }
  return { fields: { ...fields, kernel, sumWG, sumWGG }, strength, direction };
}
