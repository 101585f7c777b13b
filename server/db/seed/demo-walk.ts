/**
 * A technician walking the demo store: along the dairy line and back, down the frozen doors, between
 * the produce islands, along the meat line and back, and past the bakery corner. A tap every ~1.3 m
 * on arrival at each stop (and a closer re-check pass where the story asks for one), walking at 0.9 m/s and pausing 1–4 s (docs/locator/design-ranges.md). The
 * detector sees the air drawn in one transport delay earlier, through a first-order response with its
 * time constant; the display shows lognormal noise (sigma 0.25, correlated from tap to tap) plus about
 * 0.5 ppm, rounded to whole ppm.
 */
import { demoConcentration, type DemoAir } from "./demo-plume";

export type Prng = () => number;

/** mulberry32: a small seeded generator (public domain, by Tommy Ettinger). */
export function mulberry32(seed: number): Prng {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Box–Muller standard normal. */
function normal(rand: Prng): number {
  const u = Math.max(rand(), 1e-12);
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rand());
}

const ROUTE: [number, number][][] = [
  [
    [2.5, 9.8],
    [23.5, 9.8],
  ], // dairy case fronts, east
  [
    [23.5, 11.0],
    [2.8, 11.0],
  ], // back along the aisle
  [
    [2.1, 11.6],
    [2.1, 29.0],
  ], // frozen doors, south
  [
    [5.0, 16.5],
    [13.2, 16.5],
  ], // between the produce islands
  [
    [13.2, 11.2],
    [31.5, 11.2],
  ], // across the front of the back wall
  [
    [32.3, 9.8],
    [46.4, 9.8],
  ], // meat case fronts, east
  [
    [46.4, 11.0],
    [32.0, 11.0],
  ], // back along the aisle
  [
    [48.6, 12.0],
    [48.6, 31.0],
  ], // past the bakery corner
];

export interface DemoTap {
  x: number;
  y: number;
  /** Seconds from the sweep's start, at the position tap. */
  t: number;
  ppm: number;
  atLeast: boolean;
}

export interface DemoInstrument {
  transportDelayS: number;
  timeConstantS: number;
  /** The display pegs here ("at least"). */
  ceilingPpm: number;
}

/** A closer re-check after an alarm: a leg walked with taps every `spacingM`. */
export interface RecheckLeg {
  from: [number, number];
  to: [number, number];
  spacingM: number;
}

/** Tap points every ~1.3 m along each leg (the last point of a leg included), then any re-check legs. */
function tapPoints(rand: Prng, rechecks: readonly RecheckLeg[]): [number, number][] {
  const out: [number, number][] = [];
  const legs = [...ROUTE.map(([a, b]) => ({ from: a, to: b, spacingM: 1.3 })), ...rechecks];
  for (const {
    from: [ax, ay],
    to: [bx, by],
    spacingM,
  } of legs) {
    const len = Math.hypot(bx - ax, by - ay);
    const n = Math.max(1, Math.round(len / spacingM));
    for (let k = 0; k <= n; k++) {
      // tap jitter about 0.15 m: where the technician's finger lands on the plan
      out.push([ax + ((bx - ax) * k) / n + 0.15 * normal(rand), ay + ((by - ay) * k) / n + 0.15 * normal(rand)]);
    }
  }
  return out;
}

export function simulateDemoWalk(
  air: DemoAir,
  instrument: DemoInstrument,
  rand: Prng,
  rechecks: readonly RecheckLeg[] = [],
  startDelayS = 12,
): DemoTap[] {
  const points = tapPoints(rand, rechecks);
  const dt = 0.1;
  const speed = 0.9;
  // the walk as a time series of positions: arrive, dwell 1–4 s, walk on
  const track: [number, number][] = [];
  const tapStep: number[] = [];
  let [x, y] = points[0];
  for (let s = 0; s < startDelayS / dt; s++) track.push([x, y]);
  for (let k = 0; k < points.length; k++) {
    const [px, py] = points[k];
    const steps = Math.ceil(Math.hypot(px - x, py - y) / speed / dt);
    for (let s = 1; s <= steps; s++) track.push([x + ((px - x) * s) / steps, y + ((py - y) * s) / steps]);
    x = px;
    y = py;
    tapStep.push(track.length - 1);
    const dwell = 1 + 3 * rand();
    for (let s = 0; s < dwell / dt; s++) track.push([x, y]);
  }
  // sensor: the air drawn in one transport delay ago, through a first-order response
  const lagSteps = Math.round(instrument.transportDelayS / dt);
  const alpha = instrument.timeConstantS > 0 ? 1 - Math.exp(-dt / instrument.timeConstantS) : 1;
  const sensed = new Float64Array(track.length);
  let state = demoConcentration(air, track[0][0], track[0][1]);
  for (let s = 0; s < track.length; s++) {
    const [sx, sy] = track[Math.max(0, s - lagSteps)];
    state += alpha * (demoConcentration(air, sx, sy) - state);
    sensed[s] = state;
  }
  let z = 0;
  return tapStep.map((s, k) => {
    z = 0.6 * z + 0.8 * normal(rand);
    const shown = sensed[s] * Math.exp(0.25 * z - 0.03) + 0.5 * normal(rand);
    const ppm = Math.max(0, Math.round(shown));
    const pegged = ppm >= instrument.ceilingPpm;
    return { x: points[k][0], y: points[k][1], t: s * dt, ppm: pegged ? instrument.ceilingPpm : ppm, atLeast: pegged };
  });
}
