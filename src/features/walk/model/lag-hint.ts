import { alongPolyline, lagCorrect, type Tap } from "../../../../server/analysis/lag/lag-correct";

/**
 * Closer spacing for a re-check around where an alarm's air was sampled: about 0.6 m
 * (common practice, no published source).
 */
export const RECHECK_SPACING_M = 0.6;
const RECHECK_EACH_SIDE = 3;

export interface LagHint {
  /** Index of the alarm reading in the path. */
  index: number;
  /** Where the air behind the alarm was really sampled (the shared lag function). */
  x: number;
  y: number;
  /** The alarm came before one transport delay had passed since the first reading. */
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
}

function cumulative(path: readonly (readonly [number, number])[]): number[] {
  const out = [0];
  for (let i = 1; i < path.length; i++) out.push(out[i - 1] + Math.hypot(path[i][0] - path[i - 1][0], path[i][1] - path[i - 1][1]));
  return out;
}

/**
 * For the latest reading at or above the alarm level: the lag-corrected point (one transport
 * delay plus the sensor's time constant back along the path, interpolated by timestamps, by the
 * same lagCorrect the server's locator uses) and re-check spots around it. Null when no alarm.
 */
export function latestLagHint(readings: readonly PathReading[], delayS: number, timeConstantS: number, alarmPpm: number): LagHint | null {
  let index = -1;
  for (let i = readings.length - 1; i >= 0; i--) {
    if (readings[i].ppm >= alarmPpm) {
      index = i;
      break;
    }
  }
  if (index < 0) return null;
  const t0 = Date.parse(readings[0].takenAt);
  const taps: Tap[] = readings.slice(0, index + 1).map((r) => ({ x: r.x, y: r.y, t: (Date.parse(r.takenAt) - t0) / 1000 }));
  // lagCorrect needs taps in time order; an edited timestamp may break it, so sort a copy.
  const order = taps.map((_, i) => i).sort((a, b) => taps[a].t - taps[b].t);
  const sorted = order.map((i) => taps[i]);
  const lagged = lagCorrect(sorted, delayS, timeConstantS)[order.indexOf(index)];
  const path = sorted.map((t) => [t.x, t.y] as const);
  const along = cumulative(path);
  const total = along[along.length - 1];
  const backM = nearestArc(path, along, lagged.x, lagged.y);
  const recheck: { x: number; y: number }[] = [];
  for (let k = -RECHECK_EACH_SIDE; k <= RECHECK_EACH_SIDE; k++) {
    const s = total - backM + k * RECHECK_SPACING_M;
    if (s < 0 || s > total || total === 0) continue;
    const [x, y] = alongPolyline(path, s / total);
    recheck.push({ x, y });
  }
  return { index, x: lagged.x, y: lagged.y, beforeDelay: lagged.beforeDelay, backM, recheck };
}

/** Arc length from the path's END back to the path point nearest (x, y). */
function nearestArc(path: readonly (readonly [number, number])[], along: number[], x: number, y: number): number {
  const total = along[along.length - 1];
  if (path.length < 2) return 0;
  let best = Infinity;
  let bestS = total;
  for (let i = 1; i < path.length; i++) {
    const [ax, ay] = path[i - 1];
    const [bx, by] = path[i];
    const len = Math.hypot(bx - ax, by - ay);
    const g = len > 0 ? Math.max(0, Math.min(1, ((x - ax) * (bx - ax) + (y - ay) * (by - ay)) / (len * len))) : 0;
    const d = Math.hypot(ax + g * (bx - ax) - x, ay + g * (by - ay) - y);
    if (d < best - 1e-12) {
      best = d;
      bestS = along[i - 1] + g * len;
    }
  }
  return total - bestS;
}
