import { describe, expect, it } from "vitest";
import { parseLocatorInput } from "../../contracts/locator-input";
import { mixedLevel } from "./mixed-level";
import { readingAir } from "./pass-air";

const rect = (x0: number, y0: number, x1: number, y1: number): [number, number][] => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];

/** Six taps along a case's front at the given ppm (the first four with its fans running), two across the aisle. */
function case6(ppm: number[], passes: { id: string; fans: "stopped" | "running"; fixture?: string }[]) {
  const input = parseLocatorInput({
    plan: { width: 12, height: 4, fixtures: [{ id: "c", kind: "open-case", polygon: rect(1, 0, 11, 1), fans: true }] },
    instrument: { transportDelayS: 0, timeConstantS: 0, alarmPpm: 2 },
    readings: [
      ...ppm.map((v, i) => ({
        x: 1.5 + i * 1.5,
        y: 1.2,
        t: i,
        ppm: v,
        pass: i >= 4 && passes.length ? "p" : undefined,
      })),
      { x: 2, y: 3.5, t: 10, ppm: 0.5 },
      { x: 8, y: 3.5, t: 11, ppm: 0.5 },
    ],
    passes,
  });
  const n = input.readings.length;
  const lag = {
    xs: Float64Array.from(input.readings, (r) => r.x),
    ys: Float64Array.from(input.readings, (r) => r.y),
    ppm: Float64Array.from(input.readings, (r) => r.ppm),
    censored: new Uint8Array(n),
  };
  return mixedLevel(input.plan, readingAir(input), lag, new Int32Array(n).fill(-1), 2);
}

describe("the level of a mixed fixture a pass stilled", () => {
  it("takes the fans-running readings level along the case as its level only", () => {
    // level 6–6.5 ppm over a 0.5 ppm background: the fans-mixing test (10–90 % spread under half the median excess)
    const level = case6([6, 6.5, 6, 6.5, 12, 3], [{ id: "p", fans: "stopped", fixture: "c" }]);
    expect(level).not.toBeNull();
    expect(Array.from(level!.levelOnly)).toEqual([1, 1, 1, 1, 0, 0, 0, 0]);
    expect(level!.columns.map((c) => Array.from(c))).toEqual([[1, 1, 1, 1, 0, 0, 0, 0]]);
  });

  it("leaves readings that point somewhere (not level) to the point sources", () => {
    expect(case6([1, 3, 12, 3, 12, 3], [{ id: "p", fans: "stopped", fixture: "c" }])).toBeNull();
  });

  it("changes nothing without a pass that stills the fixture", () => {
    expect(case6([6, 6.5, 6, 6.5, 6, 6.5], [])).toBeNull();
    expect(case6([6, 6.5, 6, 6.5, 6, 6.5], [{ id: "p", fans: "running" }])).toBeNull();
  });
});
