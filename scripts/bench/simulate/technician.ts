// The technician: walks each sweep leg along the case fronts at a steady pace, stops every 1.2–1.5 m
// for 1–4 s and taps the position on arrival; after a leg with an alarm, walks back and re-checks that
// stretch more slowly at ~0.6 m stops. The instrument runs continuously, so every reading carries the
// hose delay and the cell's lag of the air sampled while walking.
import type { Random } from "./random";
import type { Sensor } from "./sensor";
import type { Leg, Point } from "./store-types";
import { findWalkPath, type WalkMap } from "./walk-path";

export interface TechnicianSettings {
  speed: number;
  stopSpacing: [number, number];
  dwellS: [number, number];
  recheckSpacing: [number, number];
  recheckDwellS: [number, number];
  recheckSpeedFactor: number;
  /** Per-axis standard deviation of where the tap lands on the plan (m). */
  tapJitter: number;
  alarmPpm: number;
}

export interface SimReading {
  x: number;
  y: number;
  t: number;
  ppm: number;
  atLeast?: boolean;
  /** The pinpoint pass it was taken in; absent: the first pass. */
  pass?: string;
}

interface Tap {
  s: number;
  ppm: number;
}

export const length = (pts: Point[]) =>
  pts.slice(1).reduce((acc, p, k) => acc + Math.hypot(p[0] - pts[k][0], p[1] - pts[k][1]), 0);

export function pointAt(pts: Point[], s: number): Point {
  let acc = 0;
  for (let k = 1; k < pts.length; k++) {
    const seg = Math.hypot(pts[k][0] - pts[k - 1][0], pts[k][1] - pts[k - 1][1]);
    if (acc + seg >= s || k === pts.length - 1) {
      const f = seg > 0 ? Math.max(0, Math.min(1, (s - acc) / seg)) : 0;
      return [pts[k - 1][0] + f * (pts[k][0] - pts[k - 1][0]), pts[k - 1][1] + f * (pts[k][1] - pts[k - 1][1])];
    }
    acc += seg;
  }
  return pts[0];
}

/** Vertex-respecting waypoints from arc length a to b (either direction), excluding the point at a. */
function between(pts: Point[], a: number, b: number): Point[] {
  const marks: number[] = [0];
  for (let k = 1; k < pts.length; k++)
    marks.push(marks[k - 1] + Math.hypot(pts[k][0] - pts[k - 1][0], pts[k][1] - pts[k - 1][1]));
  const out: Point[] = [];
  if (b > a)
    for (let k = 0; k < pts.length; k++) {
      if (marks[k] > a && marks[k] < b) out.push(pts[k]);
    }
  else
    for (let k = pts.length - 1; k >= 0; k--) {
      if (marks[k] < a && marks[k] > b) out.push(pts[k]);
    }
  out.push(pointAt(pts, b));
  return out;
}

export class Technician {
  readonly readings: SimReading[] = [];
  private x: number;
  private y: number;
  private t: number;
  private stops: { s: number; t: number }[] = [];
  /** Metres walked since the sweep's clock started (the guidance benchmark counts them). */
  walkedM = 0;
  /** Arc length and clock time of each stop of the last `sweepUntilAlarm` (where the technician stood when). */
  lastStops: { s: number; t: number }[] = [];

  constructor(
    private readonly settings: TechnicianSettings,
    private readonly sensor: Sensor,
    private readonly dt: number,
    private readonly air: (x: number, y: number) => number,
    private readonly ambient: number,
    private readonly random: Random,
    private readonly bounds: { width: number; height: number },
    start: Point,
    prerollS: number,
  ) {
    [this.x, this.y] = start;
    this.t = -prerollS;
    // The instrument was already on and warmed up at the first case before the sweep's clock starts.
    while (this.t < 0) this.tick();
    this.t = 0;
  }

  private tick(): void {
    this.sensor.push(this.air(this.x, this.y), this.ambient);
    this.t += this.dt;
  }

  private moveTo(p: Point, speed: number): void {
    const d = Math.hypot(p[0] - this.x, p[1] - this.y);
    if (this.t >= 0) this.walkedM += d;
    const steps = Math.max(1, Math.ceil(d / (speed * this.dt)));
    const x0 = this.x,
      y0 = this.y;
    for (let k = 1; k <= steps; k++) {
      this.x = x0 + ((p[0] - x0) * k) / steps;
      this.y = y0 + ((p[1] - y0) * k) / steps;
      this.tick();
    }
  }

  private dwell(seconds: number): void {
    for (let k = Math.round(seconds / this.dt); k > 0; k--) this.tick();
  }

  private tap(): number {
    const { tapJitter } = this.settings;
    const reading = this.sensor.read();
    const clamp = (v: number, hi: number) => Math.min(hi - 0.01, Math.max(0.01, v));
    const r: SimReading = {
      x: Math.round(clamp(this.x + tapJitter * this.random.normal(), this.bounds.width) * 100) / 100,
      y: Math.round(clamp(this.y + tapJitter * this.random.normal(), this.bounds.height) * 100) / 100,
      t: Math.round(this.t * 10) / 10,
      ppm: reading.ppm,
    };
    if (reading.atLeast) r.atLeast = true;
    this.readings.push(r);
    return reading.ppm;
  }

  /** Walk (not sweeping) to a point elsewhere on the floor. */
  walkTo(map: WalkMap, p: Point): void {
    for (const w of findWalkPath(map, [this.x, this.y], p)) this.moveTo(w, this.settings.speed);
  }

  private sweepSpan(
    pts: Point[],
    a: number,
    b: number,
    spacing: [number, number],
    dwellS: [number, number],
    speed: number,
    stop?: (ppm: number) => boolean,
  ): Tap[] {
    const taps: Tap[] = [];
    const dir = b >= a ? 1 : -1;
    let s = a;
    let here = a;
    while (dir * (b - s) >= -1e-9) {
      for (const w of between(pts, here, s)) this.moveTo(w, speed);
      here = s;
      this.stops.push({ s, t: this.t });
      taps.push({ s, ppm: this.tap() });
      if (stop?.(taps[taps.length - 1].ppm)) return taps;
      this.dwell(this.random.uniform(dwellS[0], dwellS[1]));
      s += dir * this.random.uniform(spacing[0], spacing[1]);
    }
    return taps;
  }

  sweep(map: WalkMap, leg: Leg): void {
    const st = this.settings;
    const pts = leg.points;
    const total = length(pts);
    this.walkTo(map, pts[0]);
    const taps = this.sweepSpan(pts, 0, total, st.stopSpacing, st.dwellS, st.speed);
    const alarms = taps.filter((tp) => tp.ppm >= st.alarmPpm);
    if (alarms.length === 0) return;
    // The technician knows the gas shows up late, so the re-check starts past the last alarm and runs
    // back beyond the first one.
    const last = taps[taps.length - 1].s;
    const hi = Math.min(last, Math.max(...alarms.map((a) => a.s)) + 1);
    const lo = Math.max(0, Math.max(hi - 15, Math.min(...alarms.map((a) => a.s)) - this.random.uniform(2.5, 4)));
    for (const w of between(pts, last, hi)) this.moveTo(w, st.speed);
    this.sweepSpan(pts, hi, lo, st.recheckSpacing, st.recheckDwellS, st.speed * st.recheckSpeedFactor);
  }

  /**
   * The first pass of a leg, from arc length `fromS`, that stops at the first reading at or above the
   * alarm (the closed-loop guidance benchmark takes over there). Returns that stop's arc length, or null.
   */
  sweepUntilAlarm(map: WalkMap, leg: Leg, fromS = 0): number | null {
    const st = this.settings;
    const total = length(leg.points);
    if (fromS > total) return null;
    this.walkTo(map, pointAt(leg.points, fromS));
    this.stops = [];
    const taps = this.sweepSpan(
      leg.points,
      fromS,
      total,
      st.stopSpacing,
      st.dwellS,
      st.speed,
      (ppm) => ppm >= st.alarmPpm,
    );
    this.lastStops = this.stops;
    const last = taps[taps.length - 1];
    return last && last.ppm >= st.alarmPpm ? last.s : null;
  }

  /**
   * Walks to `p` (around bodies), waits and reads the display there: `holdS` seconds when given (long
   * enough for the air drawn in at `p` to reach the display), else as long as on a sweep's re-check.
   */
  probeAt(map: WalkMap, p: Point, holdS?: number): SimReading {
    const st = this.settings;
    this.walkTo(map, p);
    this.moveTo(p, st.speed);
    this.dwell(holdS ?? this.random.uniform(st.recheckDwellS[0], st.recheckDwellS[1]));
    this.tap();
    return this.readings[this.readings.length - 1];
  }

  /** Stands where they are (the instrument keeps sampling): stopping a case's fans at its controller. */
  pause(seconds: number): void {
    this.dwell(seconds);
  }

  /** Walks to arc length `fromS` of a leg and re-checks it to `toS` at the re-check's spacing and pace. */
  recheckSpan(map: WalkMap, leg: Leg, fromS: number, toS: number): void {
    const st = this.settings;
    this.walkTo(map, pointAt(leg.points, fromS));
    this.sweepSpan(leg.points, fromS, toS, st.recheckSpacing, st.recheckDwellS, st.speed * st.recheckSpeedFactor);
  }

  get position(): Point {
    return [this.x, this.y];
  }

  /** The walking pace the technician keeps between stops (m/s). */
  get speed(): number {
    return this.settings.speed;
  }
}
