import type { SystemRecordsView } from "#core/contracts/compliance";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { KG_PER_POUND } from "#core/domain/units/mass";
import type { MassUnit } from "./figures";

/** A day (YYYY-MM-DD, the store's calendar) as a time value for a plot's axis: UTC midnight. */
export function dayValue(day: string): number {
  return Date.parse(`${day}T00:00:00Z`);
}

/** The day as every screen writes it ("7 Dec 2026", core/domain/dates/format-in-zone.ts). */
export function dayLabel(t: number): string {
  return formatCalendarDay(new Date(t).toISOString().slice(0, 10));
}

const inUnit = (kg: number, unit: MassUnit) => (unit === "lb" ? kg / KG_PER_POUND : kg);

export interface RatePoint {
  t: number;
  day: string;
  percent: number;
  /** The threshold in force at this addition, or null where none applies. */
  threshold: number | null;
  exceeds: boolean;
}

/** The leak rate at each addition against its threshold, oldest first. */
export function leakRateSeries(r: SystemRecordsView): RatePoint[] {
  return r.leakRates
    .map((p) => ({
      t: dayValue(p.date),
      day: p.date,
      percent: p.percent,
      threshold: p.thresholdPercent,
      exceeds: p.exceeds,
    }))
    .sort((a, b) => a.t - b.t);
}

export interface ChargePoint {
  t: number;
  day: string;
  /** Added that day, in the reader's unit. */
  added: number;
  /** Added since the first entry shown, in the reader's unit. */
  total: number;
}

/** Refrigerant added per day (voided entries left out), with the running total, in the reader's unit. */
export function chargeSeries(r: SystemRecordsView, unit: MassUnit): ChargePoint[] {
  const byDay = new Map<string, number>();
  for (const a of r.additions) if (!a.voided) byDay.set(a.addedOn, (byDay.get(a.addedOn) ?? 0) + a.amountKg);
  let total = 0;
  return [...byDay.entries()]
    .sort(([a], [b]) => a.localeCompare(b))
    .map(([day, kg]) => {
      total += kg;
      return { t: dayValue(day), day, added: inUnit(kg, unit), total: inUnit(total, unit) };
    });
}

export interface CheckPoint {
  t: number;
  day: string;
  leakFound: boolean;
}

/** The leak checks, oldest first (EU F-gas records them instead of a leak rate). */
export function leakCheckSeries(r: SystemRecordsView): CheckPoint[] {
  return r.leakChecks
    .map((c) => ({ t: dayValue(c.checkedOn), day: c.checkedOn, leakFound: c.leakFound }))
    .sort((a, b) => a.t - b.t);
}

/** The axis's time span with a little room either side, so a single point is not on the frame. */
export function timeDomain(ts: number[]): [number, number] {
  if (ts.length === 0) return [0, 1];
  const lo = Math.min(...ts);
  const hi = Math.max(...ts);
  const pad = Math.max((hi - lo) * 0.04, 7 * 86_400_000);
  return [lo - pad, hi + pad];
}
