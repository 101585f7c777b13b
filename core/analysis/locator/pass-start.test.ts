import { describe, expect, it } from "vitest";
import { passStartReadings, thinPasses, unfitted } from "./pass-start";

// Six readings: three of the first pass (model 0), three of a still-air pass (model 1).
const air = { modelOfReading: Int32Array.from([0, 0, 0, 1, 1, 1]) };
const positions = (early: number[]) => Array.from({ length: 6 }, (_, i) => ({ beforeDelay: early.includes(i) }));

describe("a pass's readings from before its first delay", () => {
  it("marks only the pass's readings taken before one delay had passed in its walk", () => {
    // readings 0 (the sweep's own start) and 3, 4 (the pass's start) were placed at their walk's first tap
    expect(Array.from(passStartReadings(air, positions([0, 3, 4]))!)).toEqual([0, 0, 0, 1, 1, 0]);
  });

  it("is null when the pass's first reading came after one delay, or when there is no pass", () => {
    expect(passStartReadings(air, positions([0]))).toBeNull();
    expect(passStartReadings({ modelOfReading: new Int32Array(3) }, positions([0, 1, 2]).slice(0, 3))).toBeNull();
  });

  it("needs one lagged position per reading", () => {
    expect(() => passStartReadings(air, positions([3]).slice(0, 5))).toThrow(/one lagged position per reading/);
  });
});

describe("readings fitted by no point source", () => {
  it("joins a stilled fixture's level readings and the pass's early ones", () => {
    const level = Uint8Array.from([1, 1, 0, 0, 0, 0]);
    const early = Uint8Array.from([0, 0, 0, 1, 1, 0]);
    expect(Array.from(unfitted(level, early)!)).toEqual([1, 1, 0, 1, 1, 0]);
    expect(unfitted(null, early)).toBe(early);
    expect(unfitted(level, null)).toBe(level);
    expect(unfitted(undefined, null)).toBeUndefined();
  });
});

describe("a pass too thin to place a spot", () => {
  const models = [[], [], []] as never[][];
  it("marks every reading of a still-air pass with fewer than two readings after its first delay", () => {
    // model 1: four readings, two early (two left); model 2: three readings, two early (one left)
    const twoPasses = { models, modelOfReading: Int32Array.from([0, 0, 1, 1, 1, 1, 2, 2, 2]) };
    const early = Uint8Array.from([0, 0, 1, 1, 0, 0, 1, 1, 0]);
    expect(thinPasses(twoPasses, early)).toEqual({
      readings: Uint8Array.from([0, 0, 0, 0, 0, 0, 1, 1, 1]),
      allThin: false,
    });
  });

  it("says when every pass is thin, and is null when none is", () => {
    const one = { models: models.slice(0, 2), modelOfReading: Int32Array.from([0, 0, 0, 1, 1, 1]) };
    expect(thinPasses(one, null)).toBeNull();
    expect(thinPasses(one, Uint8Array.from([0, 0, 0, 1, 1, 0]))).toEqual({
      readings: Uint8Array.from([0, 0, 0, 1, 1, 1]),
      allThin: true,
    });
  });
});
