/**
 * A stored sweep as the locator's input: readings in time order with t in seconds from the sweep's
 * start at the position tap (a tap a moment before the recorded start counts from that tap), the
 * over-range flag and sample point carried through, the instrument figures of this analysis.
 */
import type { LocatorInputRaw } from "../../contracts/locator-input";
import type { LocatorPlan } from "../layout/to-locator-input";

export interface SweepReadingRow {
  id: string;
  x: number;
  y: number;
  takenAt: Date;
  ppm: number;
  atLeast: boolean;
  samplePoint: "grille" | "supply" | "return" | "floor" | "high" | "ambient";
  note: string;
}

export interface InstrumentFigures {
  transportDelayS: number;
  timeConstantS: number;
  alarmPpm: number;
}

export function sweepLocatorInput(
  plan: LocatorPlan,
  startedAt: Date,
  rows: readonly SweepReadingRow[],
  instrument: InstrumentFigures,
): { input: LocatorInputRaw; readingIds: string[] } {
  const sorted = [...rows].sort(
    (a, b) => a.takenAt.getTime() - b.takenAt.getTime() || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0),
  );
  const t0 = Math.min(startedAt.getTime(), sorted[0]?.takenAt.getTime() ?? startedAt.getTime());
  return {
    readingIds: sorted.map((r) => r.id),
    input: {
      plan,
      instrument: { ...instrument },
      readings: sorted.map((r) => ({
        x: r.x,
        y: r.y,
        t: (r.takenAt.getTime() - t0) / 1000,
        ppm: r.ppm,
        ...(r.atLeast ? { atLeast: true } : {}),
        point: r.samplePoint,
        ...(r.note ? { note: r.note } : {}),
      })),
    },
  };
}
