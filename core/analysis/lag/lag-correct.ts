// Shared by the server's locator and the Walk screen's lag hint, so both agree by construction.
// Pure TypeScript: no Node or DOM APIs.

export interface Tap {
  x: number;
  y: number;
  /** Seconds from the sweep's start, at the position tap. */
  t: number;
  /** The pinpoint pass the tap belongs to (absent or null: the first pass); a change of pass starts a new walk. */
  pass?: string | null;
}

/** The walked route from tap a to tap b as a polyline that starts at a and ends at b, or null if unknown. */
export type Route = (a: Tap, b: Tap) => readonly (readonly [number, number])[] | null;

export interface LaggedPosition {
  x: number;
  y: number;
  /** The reading was taken before one delay had elapsed since its walk began: it is placed at the walk's first tap. */
  beforeDelay: boolean;
  /** The probe was between two taps farther apart than `maxStepM`, so where it went is a guess. */
  pathGap: boolean;
}

/**
 * Where the air behind each reading was sampled. A probe with hose delay D and a first-order sensor of
 * time constant τ reports at time t what it drew in around t − D − τ (the mean delay of the response
 * τ·ẏ + y = u(t − D) is D + τ), so each reading moves back to the probe position at s = t − D − τ,
 * interpolated in time between the taps around s and along the walked route between them (around solid
 * bodies when `route` says so; straight otherwise), evenly or stop-and-go (`walkSpeedMps`).
 * Taps must be in time order.
 *
 * The walked path is cut into walks: a pinpoint pass starts a new one (the technician went to stop the
 * fans or start a defrost, which takes minutes), and so does a pause much longer than the shift. No
 * reading is moved back across the cut: where the probe was before a walk's first tap is not known, so a
 * reading taken less than one shift into a walk is placed at its first tap, as at the sweep's start.
 */
export interface LagOptions {
  /** The walked route between taps; straight when absent. */
  route?: Route;
  /** Taps farther apart than this are flagged as a path gap, m. */
  maxStepM?: number;
  /**
   * Walking pace between stops, m/s. When given, the technician is taken to stand at each tap until
   * leaving for the next one at this pace and arriving on time (stop-and-go, as a sweep is walked);
   * when absent, the probe moves evenly between taps (plain interpolation by timestamps).
   */
  walkSpeedMps?: number;
}

/**
 * A pause of at least `minS` and `shifts` times the shift (delay + τ) starts a new walk. The pause is
 * the time between two taps less the walk between them at `walkSpeedMps` (the whole gap without a
 * pace), so a long walk across the store is not a pause. A minute and ten shifts: far longer than a
 * stop of a sweep or a re-check (seconds) and than a slow walker's surplus on a crossing of a large
 * store, shorter than stopping a case's fans and letting the air settle (common practice, no
 * published source).
 */
export const NEW_WALK_PAUSE = { minS: 60, shifts: 10 } as const;

export function lagCorrect(
  taps: readonly Tap[],
  delayS: number,
  timeConstantS: number,
  options: LagOptions = {},
): LaggedPosition[] {
  const { walkSpeedMps } = options;
  if (walkSpeedMps !== undefined && !(walkSpeedMps > 0))
    throw new Error(`walking speed must be positive, got ${walkSpeedMps} m/s`);
  checkShift(delayS, timeConstantS);
  return lagCorrector(taps, options)(delayS, timeConstantS);
}

function checkShift(delayS: number, timeConstantS: number): void {
  if (!(delayS >= 0) || !(timeConstantS >= 0))
    throw new Error(`delay and time constant must be non-negative, got ${delayS} s and ${timeConstantS} s`);
}

/**
 * lagCorrect for one walk and many shifts: the delay check corrects the same taps for 33 trial shifts,
 * so the taps' order is checked, each leg's route and length found and each pause's walks cut once,
 * not once per shift (docs/decisions/0163). Every position is the same number lagCorrect gives.
 */
export function lagCorrector(
  taps: readonly Tap[],
  options: LagOptions = {},
): (delayS: number, timeConstantS: number) => LaggedPosition[] {
  const into = lagCorrectorInto(taps, options);
  const n = taps.length;
  return (delayS, timeConstantS) => {
    const out = {
      xs: new Float64Array(n),
      ys: new Float64Array(n),
      beforeDelay: new Uint8Array(n),
      pathGap: new Uint8Array(n),
    };
    into(delayS, timeConstantS, out);
    return Array.from({ length: n }, (_, k) => ({
      x: out.xs[k],
      y: out.ys[k],
      beforeDelay: out.beforeDelay[k] === 1,
      pathGap: out.pathGap[k] === 1,
    }));
  };
}

/** Lagged positions as arrays, one entry per tap (1 = true in the flags). */
export interface LaggedArrays {
  readonly xs: Float64Array;
  readonly ys: Float64Array;
  readonly beforeDelay: Uint8Array;
  readonly pathGap: Uint8Array;
}

/**
 * lagCorrector writing into arrays the caller keeps: the delay check's 33 trial shifts allocate no
 * object or point per tap (docs/decisions/0163). The same numbers as lagCorrect.
 */
export function lagCorrectorInto(
  taps: readonly Tap[],
  options: LagOptions = {},
): (delayS: number, timeConstantS: number, out: LaggedArrays) => void {
  const { route, maxStepM = 5, walkSpeedMps } = options;
  if (walkSpeedMps !== undefined && !(walkSpeedMps > 0))
    throw new Error(`walking speed must be positive, got ${walkSpeedMps} m/s`);
  for (let k = 1; k < taps.length; k++) {
    if (taps[k].t < taps[k - 1].t)
      throw new Error(`taps must be in time order: tap ${k} at ${taps[k].t} s follows ${taps[k - 1].t} s`);
  }
  const routes: (readonly (readonly [number, number])[] | undefined)[] = [];
  const routeOf = (j: number) => {
    let r = routes[j];
    if (!r) {
      const a = taps[j];
      const b = taps[j + 1];
      r = (route && route(a, b)) || [
        [a.x, a.y],
        [b.x, b.y],
      ];
      routes[j] = r;
    }
    return r;
  };
  // the first and last tap of each tap's walk, by the pause that cuts walks (it grows with the shift)
  const walksByPause = new Map<number, { firstOf: Int32Array; lastOf: Int32Array }>();
  const walksOf = (pauseS: number) => {
    let walks = walksByPause.get(pauseS);
    if (!walks) {
      const firstOf = new Int32Array(taps.length);
      for (let k = 1; k < taps.length; k++) {
        const gap = taps[k].t - taps[k - 1].t;
        const newPass = (taps[k].pass ?? null) !== (taps[k - 1].pass ?? null);
        // the route is asked for only when the gap alone could be a pause
        const paused =
          gap > pauseS && gap - (walkSpeedMps !== undefined ? lengthOf(routeOf(k - 1)) / walkSpeedMps : 0) > pauseS;
        firstOf[k] = newPass || paused ? k : firstOf[k - 1];
      }
      const lastOf = new Int32Array(taps.length);
      for (let k = taps.length - 1; k >= 0; k--)
        lastOf[k] = k + 1 < taps.length && firstOf[k + 1] === firstOf[k] ? lastOf[k + 1] : k;
      walks = { firstOf, lastOf };
      walksByPause.set(pauseS, walks);
    }
    return walks;
  };
  const point: [number, number] = [0, 0];
  return (delayS, timeConstantS, out) => {
    checkShift(delayS, timeConstantS);
    const shift = delayS + timeConstantS;
    const { firstOf, lastOf } = walksOf(Math.max(NEW_WALK_PAUSE.minS, NEW_WALK_PAUSE.shifts * shift));
    const { xs, ys, beforeDelay, pathGap } = out;
    for (let k = 0; k < taps.length; k++) {
      const s = taps[k].t - shift;
      const first = taps[firstOf[k]];
      beforeDelay[k] = 0;
      pathGap[k] = 0;
      if (s < first.t) {
        xs[k] = first.x;
        ys[k] = first.y;
        beforeDelay[k] = 1;
        continue;
      }
      const j = Math.min(lastTapAtOrBefore(taps, s), lastOf[k]);
      if (j >= lastOf[k]) {
        xs[k] = taps[j].x;
        ys[k] = taps[j].y;
        continue;
      }
      const a = taps[j];
      const b = taps[j + 1];
      const path = routeOf(j);
      const span = b.t - a.t;
      let f = span > 0 ? (s - a.t) / span : 0;
      const length = lengthOf(path);
      if (walkSpeedMps !== undefined && span > 0) {
        const walkS = Math.min(span, length / walkSpeedMps);
        const leave = b.t - walkS;
        f = s <= leave ? 0 : walkS > 0 ? (s - leave) / walkS : 1;
      }
      pointAlong(path, f, length, point);
      xs[k] = point[0];
      ys[k] = point[1];
      pathGap[k] = Math.hypot(b.x - a.x, b.y - a.y) > maxStepM ? 1 : 0;
    }
  };
}

/** Index of the last tap with t ≤ s (binary search); taps[0].t ≤ s is assumed. */
function lastTapAtOrBefore(taps: readonly Tap[], s: number): number {
  let lo = 0;
  let hi = taps.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (taps[mid].t <= s) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

// A remembered route hands out the same polyline for a leg every time, and the delay check corrects the
// same walk for 33 trial shifts: each polyline's length is worked out once (docs/decisions/0160).
const lengths = new WeakMap<readonly (readonly [number, number])[], number>();

function lengthOf(points: readonly (readonly [number, number])[]): number {
  let length = lengths.get(points);
  if (length === undefined) {
    length = polylineLength(points);
    lengths.set(points, length);
  }
  return length;
}

function polylineLength(points: readonly (readonly [number, number])[]): number {
  let total = 0;
  for (let i = 1; i < points.length; i++)
    total += Math.hypot(points[i][0] - points[i - 1][0], points[i][1] - points[i - 1][1]);
  return total;
}

/** The point a fraction f (0..1) of the way along a polyline, by arc length (`length`: the polyline's, when known). */
export function alongPolyline(
  points: readonly (readonly [number, number])[],
  f: number,
  length = polylineLength(points),
): [number, number] {
  return pointAlong(points, f, length, [0, 0]);
}

/** alongPolyline into `out` (returned). */
function pointAlong(
  points: readonly (readonly [number, number])[],
  f: number,
  length: number,
  out: [number, number],
): [number, number] {
  if (points.length === 1) {
    out[0] = points[0][0];
    out[1] = points[0][1];
    return out;
  }
  let left = Math.max(0, Math.min(1, f)) * length;
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
    if (left <= len || i === points.length - 1) {
      const g = len > 0 ? Math.min(1, left / len) : 0;
      out[0] = a[0] + g * (b[0] - a[0]);
      out[1] = a[1] + g * (b[1] - a[1]);
      return out;
    }
    left -= len;
  }
  const last = points[points.length - 1];
  out[0] = last[0];
  out[1] = last[1];
  return out;
}
