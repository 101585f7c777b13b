import { describe, expect, it } from "vitest";
import { latestLagHint, RECHECK_SPACING_M } from "./lag-hint";

const start = Date.parse("2026-11-02T14:00:00Z");
const walk = (n: number, ppmAt: (i: number) => number) =>
  Array.from({ length: n }, (_, i) => ({ x: i, y: 0, takenAt: new Date(start + i * 1000).toISOString(), ppm: ppmAt(i), atLeast: false }));

describe("the Walk screen's lag hint", () => {
  it("marks the alarm's air 5 m back on a 1 m/s straight walk with a 5 s delay (common practice delay, worked example)", () => {
    const hint = latestLagHint(walk(13, (i) => (i === 12 ? 6 : 0)), 5, 0, 2)!;
    expect(hint).toMatchObject({ index: 12, x: 7, y: 0, beforeDelay: false });
    expect(hint.backM).toBeCloseTo(5, 12);
    // re-check spots every 0.6 m around x = 7 (common practice, no published source)
    expect(hint.recheck.map((p) => +p.x.toFixed(6))).toEqual([5.2, 5.8, 6.4, 7, 7.6, 8.2, 8.8]);
    expect(RECHECK_SPACING_M).toBe(0.6);
  });

  it("adds the sensor's time constant to the transport delay", () => {
    expect(latestLagHint(walk(13, (i) => (i === 12 ? 6 : 0)), 3.5, 1.5, 2)!.x).toBeCloseTo(7, 12);
  });

  it("flags an alarm before one delay has passed and places it at the first reading", () => {
    expect(latestLagHint(walk(4, (i) => (i === 3 ? 9 : 0)), 5, 0, 2)).toMatchObject({ x: 0, beforeDelay: true });
  });

  it("gives no hint below the alarm level", () => {
    expect(latestLagHint(walk(10, () => 1.9), 5, 0, 2)).toBeNull();
  });
});
