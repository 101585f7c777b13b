import type { Route, Tap } from "./lag-correct";
import { rememberedByTap } from "./remembered-route";
import { walkLagCorrectorInto } from "./walk-lag";

/**
 * The delay checked against the readings. A wrong delay moves the readings of passes in opposite
 * directions (or at different paces, or a re-check) apart, so the same spot reads differently on each
 * visit; the right one lines them up. For each trial shift s (delay plus time constant) the readings are
 * lag-corrected by s, and the misfit is the weighted mean of (log(1 + y_i) − log(1 + y_j))² over pairs of
 * readings taken on different visits (at least `minGapS` apart) whose corrected positions lie close
 * together (Gaussian weight of width `radiusM`), at least one of them raised. The shift with the lowest
 * misfit is the estimate; it is supported when it beats the stated shift clearly and enough pairs carry it.
 */
export interface DelayCheck {
  /** The shift the detector states (transport delay + time constant), s. */
  statedS: number;
  /** The shift the readings fit best, s; null when no pairs of visits overlap (nothing to check). */
  estimatedS: number | null;
  /** Misfit at the stated and at the estimated shift (lower is better). */
  statedMisfit: number | null;
  estimatedMisfit: number | null;
  /** Sum of the pair weights at the estimate: how much overlap between visits carries it. */
  pairWeight: number;
  /** The readings clearly fit the estimate better than the stated shift. */
  supported: boolean;
}

export interface DelayCheckSettings {
  /** Trial shifts from 0 to max(`maxS`, `maxFactor` × stated), every `stepS`, s. */
  readonly stepS: number;
  readonly maxS: number;
  readonly maxFactor: number;
  /** Readings at least this far apart in time count as different visits, s. */
  readonly minGapS: number;
  /** Width of the closeness weight, m. */
  readonly radiusM: number;
  /** A reading at least this far over the background is raised, ppm. */
  readonly raisedPpm: number;
  /** Supported when the estimate's misfit is at most this share of the stated one, ... */
  readonly maxMisfitRatio: number;
  /** ... at least this much pair weight carries it (below it no trial shift counts at all), ... */
  readonly minPairWeight: number;
  /** ... the supported estimate carries at least this much, ... */
  readonly supportPairWeight: number;
  /** ... it differs from the stated shift by at least this share of it (and at least 1 s), ... */
  readonly minChange: number;
  /**
   * ... and it is at least this share of the stated shift: a detector is seldom that much faster than
   * stated, and such estimates were wrong on every benchmark store where they came up (decision 0068).
   */
  readonly minShareOfStated: number;
  /**
   * Less pair weight than `supportPairWeight` (but at least `minPairWeight`) still supports an estimate
   * whose misfit is at most this share of the stated one (a deep, clear minimum; at the stated delay the
   * two benchmark stores under it are held by the minimum change), ...
   */
  readonly thinMaxMisfitRatio: number;
  /** ... and that is at most this many times the stated shift (decision 0068). */
  readonly thinMaxShareOfStated: number;
}

export const DELAY_CHECK_SETTINGS: DelayCheckSettings = {
  stepS: 0.5,
  maxS: 15,
  maxFactor: 2.5,
  minGapS: 8,
  radiusM: 0.5,
  raisedPpm: 1.5,
  maxMisfitRatio: 0.6,
  minPairWeight: 4,
  supportPairWeight: 10,
  minChange: 0.35,
  minShareOfStated: 0.4,
  thinMaxMisfitRatio: 0.4,
  thinMaxShareOfStated: 2,
};

export function checkDelay(
  readings: readonly (Tap & { ppm: number })[],
  statedS: number,
  backgroundPpm: number,
  route: Route | undefined,
  walkSpeedMps: number | undefined,
  settings: DelayCheckSettings = DELAY_CHECK_SETTINGS,
): DelayCheck {
  const n = readings.length;
  const logY = Float64Array.from(readings, (r) => Math.log1p(r.ppm));
  const raised = Uint8Array.from(readings, (r) => (r.ppm - backgroundPpm >= settings.raisedPpm ? 1 : 0));
  const none: DelayCheck = {
    statedS,
    estimatedS: null,
    statedMisfit: null,
    estimatedMisfit: null,
    pairWeight: 0,
    supported: false,
  };
  const raisedIdx: number[] = [];
  for (let i = 0; i < n; i++) if (raised[i]) raisedIdx.push(i);
  if (raisedIdx.length === 0) return none;
  // Every trial shift asks for the same legs between consecutive taps.
  const cachedRoute: Route | undefined = route ? rememberedByTap(route) : undefined;
  const r2 = 2 * settings.radiusM * settings.radiusM;
  const cut2 = 9 * settings.radiusM * settings.radiusM;
  // the walk is cut and its legs routed once for every trial shift (docs/decisions/0163)
  const lagInto = walkLagCorrectorInto(readings, cachedRoute, walkSpeedMps);
  const p = {
    xs: new Float64Array(n),
    ys: new Float64Array(n),
    beforeDelay: new Uint8Array(n),
    pathGap: new Uint8Array(n),
  };
  const { xs, ys, beforeDelay } = p;
  const misfitAt = (shift: number): { misfit: number; weight: number } => {
    lagInto(shift, 0, p);
    // readings in square buckets as wide as the closeness cut-off, so each raised reading meets only
    // its neighbours (the pairs and their order are those of a full scan over j)
    const size = Math.sqrt(cut2);
    const buckets = new Map<number, number[]>();
    const keyOf = (bx: number, by: number) => bx * 1_000_003 + by;
    for (let j = 0; j < n; j++) {
      if (beforeDelay[j]) continue;
      const k = keyOf(Math.floor(xs[j] / size), Math.floor(ys[j] / size));
      const list = buckets.get(k);
      if (list) list.push(j);
      else buckets.set(k, [j]);
    }
    let sw = 0;
    let swd = 0;
    const near: number[] = [];
    // every pair with at least one raised reading, once (a pair of two raised readings from the lower index)
    for (let r = 0; r < raisedIdx.length; r++) {
      const i = raisedIdx[r];
      if (beforeDelay[i]) continue;
      const bx = Math.floor(xs[i] / size);
      const by = Math.floor(ys[i] / size);
      near.length = 0;
      for (let dx = -1; dx <= 1; dx++)
        for (let dy = -1; dy <= 1; dy++) {
          const list = buckets.get(keyOf(bx + dx, by + dy));
          if (list) for (let q = 0; q < list.length; q++) near.push(list[q]);
        }
      near.sort((a, b) => a - b);
      for (let q = 0; q < near.length; q++) {
        const j = near[q];
        if (j === i || (raised[j] && j < i)) continue;
        if (Math.abs(readings[j].t - readings[i].t) < settings.minGapS) continue;
        const d2 = (xs[i] - xs[j]) ** 2 + (ys[i] - ys[j]) ** 2;
        if (d2 > cut2) continue;
        const w = Math.exp(-d2 / r2);
        sw += w;
        swd += w * (logY[i] - logY[j]) ** 2;
      }
    }
    return { misfit: sw > 0 ? swd / sw : Infinity, weight: sw };
  };
  const stated = misfitAt(statedS);
  const top = Math.max(settings.maxS, settings.maxFactor * statedS);
  let best = { shift: statedS, ...stated };
  for (let s = 0; s <= top + 1e-9; s += settings.stepS) {
    // the stated shift is often one of the trial shifts: its misfit is already known
    const m = s === statedS ? stated : misfitAt(s);
    // a misfit carried by too little overlap says nothing
    if (m.weight >= settings.minPairWeight && m.misfit < best.misfit) best = { shift: s, ...m };
  }
  if (!Number.isFinite(best.misfit)) return none;
  // much overlap, or a clear minimum not too far above the stated shift on less of it
  const carried =
    best.weight >= settings.supportPairWeight ||
    (best.misfit <= settings.thinMaxMisfitRatio * stated.misfit &&
      best.shift <= settings.thinMaxShareOfStated * statedS);
  const supported =
    carried &&
    Number.isFinite(stated.misfit) &&
    best.misfit <= settings.maxMisfitRatio * stated.misfit &&
    Math.abs(best.shift - statedS) >= Math.max(1, settings.minChange * statedS) &&
    best.shift >= settings.minShareOfStated * statedS;
  return {
    statedS,
    estimatedS: best.shift,
    statedMisfit: Number.isFinite(stated.misfit) ? stated.misfit : null,
    estimatedMisfit: best.misfit,
    pairWeight: best.weight,
    supported,
  };
}
