import { describe, expect, it } from "vitest";
import { createPlanGrid } from "../grid/plan-grid";
import { gridRoute } from "./grid-route";
import { lagCorrect, lagCorrector, NEW_WALK_PAUSE, type Tap } from "./lag-correct";

// Worked example (docs/locator/method.md, lag correction): walking 1 m/s with 5 s of delay, a reading describes the air 5 m back.
describe("lag correction", () => {
  const line: Tap[] = Array.from({ length: 21 }, (_, t) => ({ x: t, y: 0, t }));

  it("moves a reading 5 m back along a straight 1 m/s walk with 5 s of total delay", () => {
    const out = lagCorrect(line, 5, 0);
    expect(out[12]).toEqual({ x: 7, y: 0, beforeDelay: false, pathGap: false });
    // the sensor's time constant adds its mean delay τ to the hose delay: D = 3.5 s, τ = 1.5 s is 5 m too
    expect(lagCorrect(line, 3.5, 1.5)[12].x).toBeCloseTo(7, 12);
  });

  it("interpolates by timestamps between irregular taps", () => {
    const taps: Tap[] = [
      { x: 0, y: 0, t: 0 },
      { x: 2, y: 0, t: 4 },
      { x: 3, y: 0, t: 10 },
      { x: 3, y: 0, t: 13 },
    ];
    // s = 13 − 5 = 8: two thirds of the way from the tap at 4 s (x 2) to the tap at 10 s (x 3)
    expect(lagCorrect(taps, 5, 0)[3].x).toBeCloseTo(2 + 4 / 6, 12);
  });

  it("follows a path with a turn", () => {
    const taps: Tap[] = [
      { x: 0, y: 0, t: 0 },
      { x: 4, y: 0, t: 4 },
      { x: 4, y: 4, t: 8 },
      { x: 4, y: 6, t: 10 },
    ];
    const out = lagCorrect(taps, 5, 0);
    expect([out[2].x, out[2].y]).toEqual([3, 0]); // s = 3: still on the first leg
    expect([out[3].x, out[3].y]).toEqual([4, 1]); // s = 5: one metre after the corner
  });

  it("with a walking pace, keeps the probe at a tap until it must leave to arrive on time", () => {
    // stops 1.2 m apart every 4 s at 1 m/s: 2.8 s standing, then 1.2 s walking
    const taps: Tap[] = Array.from({ length: 6 }, (_, k) => ({ x: 1.2 * k, y: 0, t: 4 * k }));
    const out = lagCorrect(taps, 5, 0, { walkSpeedMps: 1 });
    expect(out[3].x).toBeCloseTo(1.4, 12); // s = 7 s: left the 1.2 m stop at 6.8 s, 0.2 m on
    expect(lagCorrect(taps, 5.5, 0, { walkSpeedMps: 1 })[3].x).toBeCloseTo(1.2, 12); // s = 6.5 s: standing at 1.2 m
    expect(lagCorrect(taps, 4.4, 0, { walkSpeedMps: 1 })[3].x).toBeCloseTo(1.2 + 0.8, 12); // s = 7.6 s: 0.8 s into the walk
    expect(lagCorrect(taps, 4.4, 0)[3].x).toBeCloseTo(1.2 + 1.2 * 0.9, 12); // evenly: 90% of the way
  });

  it("places a reading taken before one delay at the first tap and flags it", () => {
    const out = lagCorrect(line, 5, 0);
    expect(out[3]).toEqual({ x: 0, y: 0, beforeDelay: true, pathGap: false });
    expect(out[5].beforeDelay).toBe(false);
  });

  it("goes round a wall rather than through it when given the grid route", () => {
    const grid = createPlanGrid(10, 10, 0.25, [
      [
        [4.9, 0],
        [5.1, 0],
        [5.1, 6],
        [4.9, 6],
      ],
    ]);
    const taps: Tap[] = [
      { x: 2.125, y: 2.125, t: 0 },
      { x: 7.875, y: 2.125, t: 10 },
      { x: 7.875, y: 2.125, t: 15 },
    ];
    const out = lagCorrect(taps, 10, 0, { route: gridRoute(grid) });
    // s = 5 s, half way in time: half way along the detour, which passes under the wall's end (y > 6)
    expect(out[2].y).toBeGreaterThan(5.5);
    expect(Math.abs(out[2].x - 5)).toBeLessThan(0.6);
    // a straight-line interpolation would have put it inside the wall
    expect(lagCorrect(taps, 10, 0)[2]).toMatchObject({ x: 5, y: 2.125 });
  });

  it("flags a long jump between taps as a path gap and refuses times going backwards", () => {
    const taps: Tap[] = [
      { x: 0, y: 0, t: 0 },
      { x: 10, y: 0, t: 2 },
      { x: 10, y: 0, t: 6 },
    ];
    expect(lagCorrect(taps, 5, 0)[2].pathGap).toBe(true);
    expect(() =>
      lagCorrect(
        [
          { x: 0, y: 0, t: 3 },
          { x: 1, y: 0, t: 2 },
        ],
        5,
        0,
      ),
    ).toThrow(/time order/);
  });

  it("corrects one walk for many shifts as lagCorrect does for each (the delay check's trial shifts)", () => {
    // a turn, a stop, a pass and a 70 s gap that is a pause for short shifts only (the pause grows with the shift)
    const taps: Tap[] = [
      ...Array.from({ length: 8 }, (_, k) => ({ x: k < 4 ? k : 3, y: k < 4 ? 0 : k - 3, t: 2 * k })),
      { x: 3, y: 6, t: 86 },
      { x: 3, y: 7, t: 87, pass: "p2" },
      { x: 4, y: 7, t: 89, pass: "p2" },
    ];
    const grid = createPlanGrid(10, 10, 0.25, []);
    for (const walkSpeedMps of [undefined, 1]) {
      const options = { route: gridRoute(grid), walkSpeedMps };
      const correct = lagCorrector(taps, options);
      for (let shift = 0; shift <= 9; shift += 0.5)
        expect(correct(shift, 0.5)).toEqual(lagCorrect(taps, shift, 0.5, options));
    }
    expect(() => lagCorrector(taps)(-1, 0)).toThrow(/non-negative/);
    expect(() => lagCorrector([taps[1], taps[0]])).toThrow(/time order/);
  });

  describe("a pinpoint pass or a long pause starts a new walk", () => {
    // the first pass along x at 1 m/s, one tap a second from x 0 to 10
    const first: Tap[] = Array.from({ length: 11 }, (_, t) => ({ x: t, y: 0, t }));
    const then = (x0: number, t0: number, pass?: string): Tap[] =>
      Array.from({ length: 8 }, (_, k) => ({ x: x0 + k, y: 0, t: t0 + k, ...(pass ? { pass } : {}) }));

    it("places a pass's first readings at its first tap, not back along the walk from the last pass", () => {
      // four seconds later the pass starts at x 12: s = 14 - 5 = 9 s would be x 9 in the first pass
      const taps = [...first, ...then(12, 14, "p2")];
      const out = lagCorrect(taps, 5, 0, { walkSpeedMps: 1 });
      expect(out[11]).toEqual({ x: 12, y: 0, beforeDelay: true, pathGap: false });
      expect(out.slice(11, 16).map((p) => p.beforeDelay)).toEqual([true, true, true, true, true]);
      // five seconds into the pass the walk is its own again: x 17 at 19 s was sampled at x 12
      expect(out[16]).toEqual({ x: 12, y: 0, beforeDelay: false, pathGap: false });
      expect(out[18].x).toBe(14);
      // the same taps in one pass: moved back across the gap as before (s = 9 s: x 9)
      expect(lagCorrect([...first, ...then(12, 14)], 5, 0, { walkSpeedMps: 1 })[11].x).toBe(9);
    });

    it("starts a walk again when the pass ends and readings return to the first pass", () => {
      const taps = [...first, ...then(12, 14, "p2"), ...then(30, 40)];
      const out = lagCorrect(taps, 5, 0, { walkSpeedMps: 1 });
      expect(out[19]).toEqual({ x: 30, y: 0, beforeDelay: true, pathGap: false });
      // a null pass is the first pass, as an absent one
      const nulls = taps.map((tp) => ({ ...tp, pass: tp.pass ?? null }));
      expect(lagCorrect(nulls, 5, 0, { walkSpeedMps: 1 })).toEqual(out);
    });

    it("takes a pause of over a minute and ten shifts, less the walk at pace, as a new walk", () => {
      expect(NEW_WALK_PAUSE).toEqual({ minS: 60, shifts: 10 });
      const at = (gapS: number, x = 12, delayS = 5, pace = true) =>
        lagCorrect([...first, { x, y: 0, t: 10 + gapS }], delayS, 0, pace ? { walkSpeedMps: 1 } : {})[11];
      // 2 m in 90 s: 88 s standing, a pause: the reading stays at its own tap
      expect(at(90)).toEqual({ x: 12, y: 0, beforeDelay: true, pathGap: false });
      // 2 m in 50 s: 48 s standing at x 10, no pause; 5 s back is still standing there
      expect(at(50)).toEqual({ x: 10, y: 0, beforeDelay: false, pathGap: false });
      // 80 m in 90 s at 1 m/s is a walk, not a pause: 5 s back is 5 m back along it
      expect(at(90, 90)).toMatchObject({ x: 85, beforeDelay: false });
      // with an 8 s delay the pause must be 80 s: 70 s (68 s standing) is none
      expect(at(70, 12, 8)).toMatchObject({ x: 10, beforeDelay: false });
      expect(at(83, 12, 8)).toMatchObject({ x: 12, beforeDelay: true });
      // without a pace the whole gap counts: 70 s is a pause
      expect(at(70, 90, 5, false)).toMatchObject({ x: 90, beforeDelay: true });
    });
  });
});
