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
  /** The pinpoint pass it was taken in; null or absent: the first pass. */
  passId?: string | null;
}

/** A pinpoint pass's conditions (the first pass's are already in the plan's fixtures). */
export interface SweepPassConditions {
  id: string;
  fans: "running" | "stopped";
  defrost: boolean;
  fixtureId: string | null;
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
  passes: readonly SweepPassConditions[] = [],
): { input: LocatorInputRaw; readingIds: string[] } {
  const sorted = [...rows].sort(
    (a, b) => a.takenAt.getTime() - b.takenAt.getTime() || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0),
  );
  // a pass over a fixture the plan's version does not draw covers nothing it can tell apart: the whole store
  const drawn = new Set(plan.fixtures.map((f) => f.id));
  const t0 = Math.min(startedAt.getTime(), sorted[0]?.takenAt.getTime() ?? startedAt.getTime());
  return {
    readingIds: sorted.map((r) => r.id),
    input: {
      plan,
      instrument: { ...instrument },
      ...(passes.length
        ? {
            passes: passes.map((p) => ({
              id: p.id,
              fans: p.fans,
              defrost: p.defrost,
              ...(p.fixtureId && drawn.has(p.fixtureId) ? { fixture: p.fixtureId } : {}),
            })),
          }
        : {}),
      readings: sorted.map((r) => ({
        x: r.x,
        y: r.y,
        t: (r.takenAt.getTime() - t0) / 1000,
        ppm: r.ppm,
        ...(r.atLeast ? { atLeast: true } : {}),
        point: r.samplePoint,
        ...(r.note ? { note: r.note } : {}),
        ...(r.passId ? { pass: r.passId } : {}),
      })),
    },
  };
}
