// Small literal stores for the stage tests: a 12 x 4 m aisle walked east along y = 2, one tap a metre.
import { parseLocatorInput, type LocatorInput, type LocatorInputRaw } from "../../contracts/locator-input";
import { createPlanGrid, type PlanGrid } from "../grid/plan-grid";

export const rect = (x0: number, y0: number, x1: number, y1: number): [number, number][] => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];

/** Taps at x = 0.5, 1.5, … 11.5 on y = 2, a second apart, with the given ppm per tap. */
export function aisle(ppm: readonly number[], plan: Partial<LocatorInputRaw["plan"]> = {}, delayS = 0): LocatorInput {
  return parseLocatorInput({
    plan: { width: 12, height: 4, ...plan },
    instrument: { transportDelayS: delayS, timeConstantS: 0, alarmPpm: 2 },
    readings: ppm.map((v, i) => ({ x: i + 0.5, y: 2, t: i, ppm: v })),
  });
}

export const gridOf = (input: LocatorInput, cellSize = 0.25): PlanGrid =>
  createPlanGrid(
    input.plan.width,
    input.plan.height,
    cellSize,
    input.plan.obstacles.map((o) => o.polygon),
  );

/** Readings of a leak at x = `at` on the aisle: background plus a peak that halves every metre. */
export const plume = (at: number, peak: number, background = 0.5) =>
  Array.from({ length: 12 }, (_, i) => Math.round(background + peak * 0.5 ** Math.abs(i + 0.5 - at)));
