import { describe, expect, it } from "vitest";
import { checkTargets, median, naiveAnswer, scoreStore, summarise, type Truth } from "./score";

// The scoring rules are the project's own, written down in docs/benchmarks.md; the checks
// below are hand-worked on tiny literal stores.
const oneLeak: Truth = {
  family: "single-fans",
  leaks: [{ x: 10, y: 5, kind: "case-back", fixtureId: "case-1" }],
  benignZoneActive: false,
};
const twoLeaks: Truth = {
  family: "two-leaks",
  leaks: [
    { x: 10, y: 5, kind: "coil", fixtureId: "case-1" },
    { x: 30, y: 5, kind: "line-set", fixtureId: "case-9" },
  ],
  benignZoneActive: false,
};
const noLeak: Truth = { family: "no-leak", leaks: [], benignZoneActive: false };
const zone = [
  [0, 0],
  [4, 0],
  [4, 4],
  [0, 4],
] as const;

describe("benchmark scoring", () => {
  it("top-1 error is the distance from the first suspect to the nearest leak (3-4-5 triangle)", () => {
    const s = scoreStore(
      oneLeak,
      [
        { x: 13, y: 9, radius: 6 },
        { x: 10, y: 5.5 },
      ],
      [],
    );
    expect(s.top1Error).toBeCloseTo(5, 12);
    expect(s.radiusCovered).toBe(true);
    expect(s.top3Within).toBe(true); // the second suspect is 0.5 m away
  });

  it("a leak store without suspects is a miss; a no-leak store with any suspect is a false alarm", () => {
    expect(scoreStore(oneLeak, [], []).miss).toBe(true);
    expect(scoreStore(oneLeak, [], []).radiusCovered).toBe(false);
    expect(scoreStore(noLeak, [{ x: 1, y: 1 }], []).falseAlarm).toBe(true);
    expect(scoreStore(noLeak, [], []).falseAlarm).toBe(false);
  });

  it("both leaks of a two-leak store must be within 1.5 m among the first four suspects", () => {
    const near = [
      { x: 50, y: 50 },
      { x: 10.5, y: 5 },
      { x: 40, y: 40 },
      { x: 31, y: 5.5 },
    ];
    expect(scoreStore(twoLeaks, near, []).bothInTop4).toBe(true);
    expect(scoreStore(twoLeaks, [...near.slice(0, 3), { x: 60, y: 60 }, { x: 30, y: 5 }], []).bothInTop4).toBe(false);
  });

  it("counts suspects inside benign-source zones", () => {
    expect(
      scoreStore(
        noLeak,
        [
          { x: 2, y: 2 },
          { x: 6, y: 2 },
        ],
        [zone],
      ).inBenignZone,
    ).toBe(1);
  });

  it("the median counts a miss as an infinite error", () => {
    const scores = [
      scoreStore(oneLeak, [{ x: 10, y: 6 }], []),
      scoreStore(oneLeak, [], []),
      scoreStore(oneLeak, [{ x: 10, y: 8 }], []),
    ];
    expect(summarise(scores).medianTop1).toBe(3);
    expect(median([4, 1, 3, 2])).toBe(2.5);
  });

  it("the naive answer is the highest raw reading, only at or above the alarm", () => {
    const readings = [
      { x: 1, y: 1, ppm: 1 },
      { x: 2, y: 2, ppm: 4 },
      { x: 3, y: 3, ppm: 4 },
    ];
    expect(naiveAnswer(readings, 2)).toEqual([{ x: 2, y: 2 }]);
    expect(naiveAnswer(readings, 5)).toEqual([]);
  });

  it("judges the targets, including half the naive answer's median", () => {
    const good = summarise([scoreStore(oneLeak, [{ x: 10, y: 5.4, radius: 1 }], []), scoreStore(noLeak, [], [])]);
    const naive = summarise([scoreStore(oneLeak, [{ x: 10, y: 7 }], [])]);
    const checks = checkTargets(good, naive);
    expect(checks.every((c) => c.pass === true || c.name.startsWith("radius"))).toBe(true);
    expect(checks.find((c) => c.name.startsWith("radius"))!.pass).toBe(false); // 100% covered is over-cautious
    expect(checkTargets(naive, good).find((c) => c.name.includes("half"))!.pass).toBe(false);
  });
});
