import { describe, expect, it } from "vitest";
import { advisedPassCase } from "./advised-case";

// An invented 40 x 12 m store (the live guide's test store, core/analysis/guide/live-guide.test.ts): five
// 2.4 m cases with fans against the north wall from x = 2, a technician walking east along y = 2.2, a tap
// every metre and every two seconds.
const rect = (x0: number, y0: number, x1: number, y1: number) => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];
const plan = {
  width: 40,
  height: 12,
  obstacles: [{ id: "wall", polygon: rect(0, 11.8, 40, 12) }],
  fixtures: [0, 1, 2, 3, 4].map((k) => ({
    id: `case-${k + 1}`,
    kind: "open-case",
    polygon: rect(2 + 2.4 * k, 0, 4.4 + 2.4 * k, 1),
    fans: true,
  })),
  riskPoints: [],
};
const instrument = { transportDelayS: 0, timeConstantS: 0, alarmPpm: 2 };
const walk = (ppmAt: (x: number) => number) =>
  Array.from({ length: 36 }, (_, i) => ({ x: 1 + i, y: 2.2, t: 2 * i, ppm: ppmAt(1 + i) }));

describe("the case the product advises stilling", () => {
  it("is the case the live first suspect has settled on over the last three estimates", () => {
    // a plume that halves every metre from a leak at the front of case 3 (x 6.8–9.2), over 0.4 ppm
    const readings = walk((x) => Math.round(0.4 + 14 * 0.5 ** Math.hypot(x - 8, 2.2 - 0.9)));
    expect(advisedPassCase({ plan, instrument, readings })).toEqual({ why: "settled-suspect", fixtureId: "case-3" });
  });

  it("is none when no reading reaches the alarm: the technician falls back on the trade's rule", () => {
    const readings = walk(() => 0.4);
    expect(advisedPassCase({ plan, instrument, readings })).toEqual({ why: "no-advice", fixtureId: null });
  });
});
