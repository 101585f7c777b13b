// Scoring of the locator benchmark, exactly as docs/benchmarks.md defines it:
// top-1 error = distance from the first suspect spot to the nearest true leak; a leak store with no
// suspect is a miss; on a no-leak store any suspect at all is a false alarm; in two-leak stores both
// leaks should be among the first four. Pure functions, so the naive answer is scored the same way.
import { pointInPolygon } from "#core/analysis/geometry/point-in-polygon";
import type { Polygon, Vec } from "#core/analysis/geometry/types";

export interface Suspect {
  x: number;
  y: number;
  /** Uncertainty radius (m); absent for answers that have none (the naive one). */
  radius?: number;
}

export interface Truth {
  family: string;
  leaks: { x: number; y: number; kind: string; fixtureId: string }[];
  benignZoneActive: boolean;
}

export interface StoreScore {
  family: string;
  leakStore: boolean;
  /** null when the store has no leak or the answer named no suspect (a miss). */
  top1Error: number | null;
  miss: boolean;
  top3Within: boolean;
  falseAlarm: boolean;
  inBenignZone: number;
  /** null when the answer gives no radius. */
  radiusCovered: boolean | null;
  /** null outside two-leak stores. */
  bothInTop4: boolean | null;
}

/** How close a suspect must be to count as finding a leak (1.5 m, docs/benchmarks.md). */
export const FOUND_WITHIN_M = 1.5;

const dist = (a: { x: number; y: number }, b: { x: number; y: number }) => Math.hypot(a.x - b.x, a.y - b.y);

export function scoreStore(truth: Truth, suspects: readonly Suspect[], zones: readonly Polygon[]): StoreScore {
  const leaks = truth.leaks;
  const leakStore = leaks.length > 0;
  const nearest = (s: Suspect) => Math.min(...leaks.map((l) => dist(s, l)));
  const first = suspects[0];
  const top1Error = leakStore && first ? nearest(first) : null;
  const inBenignZone = suspects.filter((s) => zones.some((z) => pointInPolygon([s.x, s.y] as Vec, z))).length;
  const radiusCovered =
    leakStore && first && first.radius !== undefined ? top1Error! <= first.radius : leakStore && !first ? false : null;
  const bothInTop4 =
    leaks.length >= 2 ? leaks.every((l) => suspects.slice(0, 4).some((s) => dist(s, l) <= FOUND_WITHIN_M)) : null;
  return {
    family: truth.family,
    leakStore,
    top1Error,
    miss: leakStore && !first,
    top3Within: leakStore && suspects.slice(0, 3).some((s) => nearest(s) <= FOUND_WITHIN_M),
    falseAlarm: !leakStore && suspects.length > 0,
    inBenignZone,
    radiusCovered,
    bothInTop4,
  };
}

export interface Summary {
  stores: number;
  leakStores: number;
  /** Median over leak stores, a miss counting as an infinite error (silence cannot improve it). */
  medianTop1: number | null;
  top3WithinShare: number | null;
  misses: number;
  noLeakStores: number;
  falseAlarms: number;
  falseAlarmShare: number | null;
  inBenignZone: number;
  /** Share of leak stores whose (nearest) true leak lies inside the top suspect's radius; misses count as not covered. */
  radiusCoverage: number | null;
  twoLeakStores: number;
  bothInTop4Share: number | null;
}

export function median(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  const v = [...values].sort((a, b) => a - b);
  const m = v.length >> 1;
  return v.length % 2 ? v[m] : (v[m - 1] + v[m]) / 2;
}

export function summarise(scores: readonly StoreScore[]): Summary {
  const leak = scores.filter((s) => s.leakStore);
  const clean = scores.filter((s) => !s.leakStore);
  const two = scores.filter((s) => s.bothInTop4 !== null);
  const withRadius = leak.filter((s) => s.radiusCovered !== null);
  const share = (n: number, d: number) => (d > 0 ? n / d : null);
  return {
    stores: scores.length,
    leakStores: leak.length,
    medianTop1: median(leak.map((s) => s.top1Error ?? Infinity)),
    top3WithinShare: share(leak.filter((s) => s.top3Within).length, leak.length),
    misses: leak.filter((s) => s.miss).length,
    noLeakStores: clean.length,
    falseAlarms: clean.filter((s) => s.falseAlarm).length,
    falseAlarmShare: share(clean.filter((s) => s.falseAlarm).length, clean.length),
    inBenignZone: scores.reduce((a, s) => a + s.inBenignZone, 0),
    radiusCoverage:
      withRadius.length === leak.length ? share(leak.filter((s) => s.radiusCovered).length, leak.length) : null,
    twoLeakStores: two.length,
    bothInTop4Share: share(two.filter((s) => s.bothInTop4).length, two.length),
  };
}

export interface Reading {
  x: number;
  y: number;
  ppm: number;
}

/**
 * The naive answer: the spot of the highest raw reading (the first one on a tie), named only when it
 * reaches the instrument's alarm level; below the alarm a technician would report nothing.
 */
export function naiveAnswer(readings: readonly Reading[], alarmPpm: number): Suspect[] {
  let best: Reading | null = null;
  for (const r of readings) if (!best || r.ppm > best.ppm) best = r;
  return best && best.ppm >= alarmPpm ? [{ x: best.x, y: best.y }] : [];
}

export interface TargetCheck {
  name: string;
  pass: boolean | null;
  detail: string;
}

/** The accuracy targets of docs/benchmarks.md, judged on the overall summary (null pass: cannot be judged). */
export function checkTargets(locator: Summary, naive: Summary): TargetCheck[] {
  const f = (v: number | null, digits = 2) => (v === null ? "n/a" : Number.isFinite(v) ? v.toFixed(digits) : "inf");
  const pct = (v: number | null) => (v === null ? "n/a" : `${(100 * v).toFixed(0)}%`);
  const m = locator.medianTop1,
    n = naive.medianTop1;
  return [
    { name: "median top-1 error <= 1.0 m", pass: m === null ? null : m <= 1.0, detail: `${f(m)} m` },
    {
      name: "median top-1 error <= half the naive answer's",
      pass: m === null || n === null ? null : m <= 0.5 * n,
      detail: `${f(m)} m vs naive ${f(n)} m`,
    },
    {
      name: "top-3 suspect within 1.5 m in >= 85% of leak stores",
      pass: locator.top3WithinShare === null ? null : locator.top3WithinShare >= 0.85,
      detail: pct(locator.top3WithinShare),
    },
    {
      name: "no suspect inside a benign-source zone",
      pass: locator.inBenignZone === 0,
      detail: `${locator.inBenignZone}`,
    },
    {
      name: "false alarms <= 10% of no-leak stores",
      pass: locator.falseAlarmShare === null ? null : locator.falseAlarmShare <= 0.1,
      detail: pct(locator.falseAlarmShare),
    },
    {
      name: "radius coverage 80-95% of leak stores",
      pass: locator.radiusCoverage === null ? null : locator.radiusCoverage >= 0.8 && locator.radiusCoverage <= 0.95,
      detail: pct(locator.radiusCoverage),
    },
  ];
}
