import { describe, expect, it } from "vitest";
import { parseLocatorInput } from "../../contracts/locator-input";
import { lagStage } from "./lag-stage";
import { aisle, gridOf } from "./stage-fixtures";

describe("lag stage", () => {
  it("moves each reading back along the walk by the delay and keeps the readings as arrays", () => {
    // walking 1 m/s east with a 2 s delay: a reading at x is the air of x - 2 m
    const input = aisle([0, 0, 0, 0, 9, 0, 0, 0, 0, 0, 0, 0], {}, 2);
    const lag = lagStage(input.readings, input.instrument, gridOf(input), 0);
    expect(Array.from(lag.xs.slice(2, 6))).toEqual([0.5, 1.5, 2.5, 3.5]);
    expect(Array.from(lag.ys.slice(2, 6))).toEqual([2, 2, 2, 2]);
    expect(lag.positions.slice(0, 3).map((p) => p.beforeDelay)).toEqual([true, true, false]);
    expect(lag.ppm[4]).toBe(9);
    // the cell of x 2.5 m, y 2 m on a 0.25 m grid 48 cells wide: column 10, row 8
    expect(lag.cell[4]).toBe(8 * 48 + 10);
  });

  it("marks over-range readings as censored", () => {
    const input = parseLocatorInput({
      plan: { width: 4, height: 2 },
      instrument: { transportDelayS: 0, timeConstantS: 0, alarmPpm: 2 },
      readings: [
        { x: 1, y: 1, t: 0, ppm: 3 },
        { x: 2, y: 1, t: 1, ppm: 200, atLeast: true },
      ],
    });
    expect(Array.from(lagStage(input.readings, input.instrument, gridOf(input), 0).censored)).toEqual([0, 1]);
  });

  it("adds the time constant to the delay (the first-order sensor's mean lag)", () => {
    const input = aisle(new Array(12).fill(1), {}, 1);
    const lag = lagStage(input.readings, { transportDelayS: 1, timeConstantS: 1 }, gridOf(input), 0);
    expect(lag.xs[5]).toBeCloseTo(3.5, 9);
  });
});
