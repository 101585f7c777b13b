import { describe, expect, it } from "vitest";
import type { Candidate, CorrectedReading } from "../../contracts/locator-output";
import { parseLocatorInput } from "../../contracts/locator-input";
import { rect } from "../pipeline/stage-fixtures";
import { hypothesesOf, nextProbes, type Hypothesis } from "./next-probes";
import { probePlaces } from "./probe-places";

// A 12 x 6 m aisle with two 2.4 m cases against the north wall (y 0..1), side by side, and a walk-in.
const plan = parseLocatorInput({
  plan: {
    width: 12,
    height: 6,
    obstacles: [{ id: "wall", polygon: rect(0, 5.8, 12, 6) }],
    fixtures: [
      { id: "case-4", kind: "open-case", polygon: rect(1, 0, 3.4, 1) },
      { id: "case-5", kind: "open-case", polygon: rect(3.4, 0, 5.8, 1) },
      { id: "walk-in", kind: "walk-in", polygon: rect(8, 0, 12, 3) },
    ],
    riskPoints: [{ id: "drop-1", kind: "line-set", x: 6.2, y: 0.5 }],
  },
  instrument: { transportDelayS: 0, timeConstantS: 0, alarmPpm: 2 },
  readings: [{ x: 1, y: 2, t: 0, ppm: 0 }],
}).plan;

/** A kernel that halves every metre: enough to tell places apart in these literal cases. */
const kernel = (d: number) => 0.5 ** d;

describe("probePlaces", () => {
  it("puts probes every 0.6 m along a case's open front, outside its outline, never in a wall", () => {
    const fronts = probePlaces(plan, { x: 2.2, y: 1.5 }, 1.3).filter((p) => p.fixtureId === "case-4");
    expect(fronts.length).toBeGreaterThanOrEqual(3);
    for (const p of fronts) {
      expect(p.kind).toBe("case-front");
      expect(p.y).toBeCloseTo(1.15, 5); // 0.15 m in front of the grille at y = 1
    }
    const xs = fronts.map((p) => p.x).sort((a, b) => a - b);
    for (let k = 1; k < xs.length; k++) expect(xs[k] - xs[k - 1]).toBeCloseTo(0.6, 5);
  });

  it("offers a walk-in whose wall is within reach though its middle is not", () => {
    // the walk-in's middle (10, 1.5) is 3.5 m from (6.5, 1); its west wall (x = 8) is 1.5 m away
    const places = probePlaces(plan, { x: 6.5, y: 1 }, 2);
    expect(places.filter((p) => p.fixtureId === "walk-in").map((p) => [p.kind, p.x, p.y])).toEqual([
      ["room-low", 10, 1.5],
      ["room-high", 10, 1.5],
    ]);
    expect(probePlaces(plan, { x: 5, y: 1 }, 2).some((p) => p.fixtureId === "walk-in")).toBe(false);
  });

  it("offers a walk-in from farther off when asked (roomReachM), and high at each coil in it", () => {
    const withCoil = {
      ...plan,
      riskPoints: [...plan.riskPoints, { id: "coil-1", kind: "coil" as const, x: 10, y: 0.35 }],
    };
    // the walk-in's west wall (x = 8) is 3 m from (5, 1): out of a 2 m reach, within a 4 m room reach
    expect(probePlaces(withCoil, { x: 5, y: 1 }, 2).some((p) => p.fixtureId === "walk-in")).toBe(false);
    expect(
      probePlaces(withCoil, { x: 5, y: 1 }, 2, 0.6, 4)
        .filter((p) => p.fixtureId === "walk-in")
        .map((p) => [p.kind, p.x, p.y]),
    ).toEqual([
      ["room-low", 10, 1.5],
      ["room-high", 10, 1.5],
      ["room-high", 10, 0.35],
    ]);
  });

  it("offers the middle of a walk-in low and high, and line-set drops", () => {
    const all = probePlaces(plan, { x: 8, y: 1 }, 5);
    expect(all.filter((p) => p.fixtureId === "walk-in").map((p) => p.kind)).toEqual(["room-low", "room-high"]);
    expect(all.some((p) => p.kind === "line-set" && p.x === 6.2)).toBe(true);
  });
});

describe("nextProbes", () => {
  const h = (x: number, rank: number, fixtureId: string): Hypothesis => ({
    x,
    y: 0.5,
    weight: 0.5,
    amplitude: 20,
    rank,
    fixtureId,
  });

  it("reads where two suspects predict most differently, and says which two it tells apart", () => {
    const places = probePlaces(plan, { x: 3.4, y: 1 }, 4);
    const [best] = nextProbes([h(2.2, 1, "case-4"), h(4.6, 2, "case-5")], places, kernel, { x: 3.4, y: 2 }, 1);
    // Halfway between them (x = 3.4) both predict the same: the best reading is nearer one of them.
    expect(Math.abs(best.x - 3.4)).toBeGreaterThan(1.5);
    expect(best.reason).toEqual({ kind: "separates", ranks: [1, 2], fixtureIds: ["case-4", "case-5"] });
  });

  it("suggests nothing when every hypothesis predicts the same reading everywhere", () => {
    const places = probePlaces(plan, { x: 3.4, y: 1 }, 4);
    expect(nextProbes([h(2.2, 1, "case-4"), h(2.2, 1, "case-4")], places, kernel, { x: 0, y: 0 })).toEqual([]);
  });

  it("orders up to three places for the shortest walk from where the technician stands", () => {
    const places = probePlaces(plan, { x: 3.4, y: 1 }, 6);
    const hs = [h(1.6, 1, "case-4"), h(5.2, 2, "case-5"), { ...h(6.2, 3, "drop"), fixtureId: null }];
    const from = { x: 0, y: 2 };
    const picked = nextProbes(hs, places, kernel, from);
    expect(picked).toHaveLength(3);
    const walk = (ps: { x: number; y: number }[]) =>
      ps.reduce((acc, p, k) => acc + Math.hypot(p.x - (k ? ps[k - 1].x : from.x), p.y - (k ? ps[k - 1].y : from.y)), 0);
    const reversed = [...picked].reverse();
    expect(walk(picked)).toBeLessThanOrEqual(walk(reversed));
  });
});

describe("hypothesesOf", () => {
  it("fits each hypothesis's amplitude to the readings by least squares", () => {
    const candidate: Candidate = {
      rank: 1,
      x: 2,
      y: 0.5,
      radius: 1,
      score: 1,
      strength: 1,
      strengthGPerYear: 0,
      fixtureId: "case-4",
      riskPointId: null,
      reason: "",
      nextCheck: "",
    };
    // Readings made exactly by a 12 ppm source at the candidate's centre with the halving kernel.
    const readings: CorrectedReading[] = [0, 1, 2, 3].map((k) => ({
      index: k,
      raw: { x: 2 + k, y: 0.5 },
      corrected: { x: 2 + k, y: 0.5 },
      t: k,
      ppm: 12 * 0.5 ** k,
      flags: [],
    }));
    const hs = hypothesesOf([candidate], readings, kernel);
    expect(hs).toHaveLength(5);
    expect(hs[0].amplitude).toBeCloseTo(12, 9);
    expect(hs.reduce((s, x) => s + x.weight, 0)).toBeCloseTo(1, 9);
  });
});
