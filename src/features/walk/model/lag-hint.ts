import type { Route, Tap } from "#core/analysis/lag/lag-correct";
import { alongPolyline } from "#core/analysis/lag/lag-correct";
import { walkLag } from "#core/analysis/lag/walk-lag";

/**
 * Closer spacing for a re-check around where an alarm's air was sampled: about 0.6 m
 * (common practice, no published source).
 */
export const RECHECK_SPACING_M = 0.6;
const RECHECK_EACH_SIDE = 3;

export interface LagHint {
  /** Index of the sweep's peak reading (at or above the alarm) in the path. */
  index: number;
  /** Where the air behind the alarm was really sampled (the shared lag function). */
  x: number;
  y: number;
  /** The alarm came before one transport delay had passed since its walk began (the sweep's or a pass's first reading, or the first after a long pause). */
  beforeDelay: boolean;
  /** Distance back along the walked path from the tap to that point, m. */
  backM: number;
  /** Suggested re-check spots at ~0.6 m spacing along the path around that point. */
  recheck: { x: number; y: number }[];
}

interface PathReading {
  x: number;
  y: number;
  takenAt: string;
  ppm: number;
  atLeast: boolean;
  /** The pinpoint pass it was taken in (null or absent: the first pass): a pass starts a new walk. */
  passId?: string | null;
}

/** How the walk between taps is taken: the locator's route and pace (core/analysis/lag/walk-lag.ts). */
export interface WalkModel {
  route?: Route;
  walkSpeedMps?: number;
}

type Pt = readonly [number, number];

function length(path: readonly Pt[]): number {
  let total = 0;
  for (let i = 1; i < path.length; i++) total += Math.hypot(path[i][0] - path[i - 1][0], path[i][1] - path[i - 1][1]);
  return total;
}

/** The walked polyline through taps[from..to], each leg routed as the lag function routes it. */
function walkedPath(taps: readonly Tap[], from: number, to: number, route: Route | undefined): Pt[] {
  const out: Pt[] = [[taps[from].x, taps[from].y]];
  for (let k = from; k < to; k++) {
    const leg = (route && route(taps[k], taps[k + 1])) || [
      [taps[k].x, taps[k].y],
      [taps[k + 1].x, taps[k + 1].y],
    ];
    out.push(...leg.slice(1));
  }
  return out;
}

/**
 * The sweep's peak so far: the highest reading at or above the alarm level, the latest of equal
 * ones; -1 when none. A lower alarm after it does not replace it: the peak is where to look first.
 */
export function peakIndex(readings: readonly { ppm: number }[], alarmPpm: number): number {
  let index = -1;
  for (let i = 0; i < readings.length; i++)
    if (readings[i].ppm >= alarmPpm && (index < 0 || readings[i].ppm >= readings[index].ppm)) index = i;
  return index;
}

/**
 * For the sweep's peak reading at or above the alarm level: the lag-corrected point (one transport
 * delay plus the sensor's time constant back along the walked route, by walkLag, the function the
 * server's locator uses, with the same route and pace) and re-check spots around it. Null when no
 * alarm. Only the taps from the one before the sampled moment are handed to walkLag: the result
 * for the alarm is the same (it depends on those alone) and a long sweep costs no more than a short one.
 */
export function peakLagHint(
  readings: readonly PathReading[],
  delayS: number,
  timeConstantS: number,
  alarmPpm: number,
  walk: WalkModel = {},
): LagHint | null {
  const index = peakIndex(readings, alarmPpm);
  if (index < 0) return null;
  const t0 = Date.parse(readings[0].takenAt);
  const taps: Tap[] = readings
    .slice(0, index + 1)
    .map((r) => ({ x: r.x, y: r.y, t: (Date.parse(r.takenAt) - t0) / 1000, pass: r.passId ?? null }));
  // walkLag needs taps in time order; an edited timestamp may break it, so sort a copy.
  const order = taps.map((_, i) => i).sort((a, b) => taps[a].t - taps[b].t || a - b);
  const sorted = order.map((i) => taps[i]);
  const p = order.indexOf(index);
  const s = sorted[p].t - delayS - timeConstantS;
  if (s < sorted[0].t) return { index, x: sorted[0].x, y: sorted[0].y, beforeDelay: true, backM: 0, recheck: [] };
  let j = p;
  while (j > 0 && sorted[j].t > s) j--;
  const window = sorted.slice(j, p + 1);
  const lagged = walkLag(window, delayS, timeConstantS, walk.route, walk.walkSpeedMps)[window.length - 1];
  // within one delay of a pass's start or a long pause: placed at that walk's first reading
  if (lagged.beforeDelay) return { index, x: lagged.x, y: lagged.y, beforeDelay: true, backM: 0, recheck: [] };
  // Back along the walked path to that point, and spots around it (reaching a little further back,
  // never into another pass: the walk between passes is not known).
  let k = j;
  for (
    let back = 0;
    k > 0 && back < RECHECK_EACH_SIDE * RECHECK_SPACING_M + 0.2 && sorted[k - 1].pass === sorted[k].pass;
    k--
  )
    back += Math.hypot(sorted[k].x - sorted[k - 1].x, sorted[k].y - sorted[k - 1].y);
  const path = walkedPath(sorted, k, p, walk.route);
  const total = length(path);
  const backM = nearestArc(path, lagged.x, lagged.y);
  const recheck: { x: number; y: number }[] = [];
  for (let r = -RECHECK_EACH_SIDE; r <= RECHECK_EACH_SIDE; r++) {
    const at = total - backM + r * RECHECK_SPACING_M;
    if (at < -1e-9 || at > total + 1e-9 || total === 0) continue;
    const [x, y] = alongPolyline(path, at / total);
    recheck.push({ x, y });
  }
  return { index, x: lagged.x, y: lagged.y, beforeDelay: false, backM, recheck };
}

/** Arc length from the path's END back to the path point nearest (x, y). */
function nearestArc(path: readonly Pt[], x: number, y: number): number {
  if (path.length < 2) return 0;
  let best = Infinity;
  let bestS = 0;
  let along = 0;
  for (let i = 1; i < path.length; i++) {
    const [ax, ay] = path[i - 1];
    const [bx, by] = path[i];
    const len = Math.hypot(bx - ax, by - ay);
    const g = len > 0 ? Math.max(0, Math.min(1, ((x - ax) * (bx - ax) + (y - ay) * (by - ay)) / (len * len))) : 0;
    const d = Math.hypot(ax + g * (bx - ax) - x, ay + g * (by - ay) - y);
    if (d < best - 1e-12) {
      best = d;
      bestS = along + g * len;
    }
    along += len;
  }
  return along - bestS;
}
