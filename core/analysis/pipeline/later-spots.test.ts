import { describe, expect, it } from "vitest";
import type { SuspectSpotFacts } from "../../contracts/locator-output";
import { createPlanGrid } from "../grid/plan-grid";
import { LOCATOR_SETTINGS } from "../locator/settings";
import { laterSpotsStage, withLaterSpots } from "./later-spots";

const spot = (x: number, y: number, score: number, molPerYear: number): SuspectSpotFacts => ({
  rank: 1,
  x,
  y,
  radius: 2,
  score,
  strength: 1,
  molPerYear,
  fixtureId: null,
  riskPointId: null,
  reason: { kind: "fitted", supportCount: 3, peakPpm: 6, backgroundPpm: 0.5, fixture: null, oneSided: false },
  nextChecks: [],
});

describe("the first spot, then the case-unit fit's later spots", () => {
  it("keeps the first spot and drops later spots within the separation of it", () => {
    const first = spot(10, 10, 0.8, 4);
    // the second fit's own first spot sits 1 m from the plain one (the same leak), its second 9 m away
    const out = withLaterSpots(first, [spot(11, 10, 0.9, 5), spot(19, 10, 0.5, 2)], 2, 5);
    expect(out.map((s) => [s.x, s.y])).toEqual([
      [10, 10],
      [19, 10],
    ]);
    expect(out[0]).toBe(first);
  });

  it("renumbers ranks, never scores a spot above the one before it, and gives strengths against the first", () => {
    const out = withLaterSpots(
      spot(0, 0, 0.6, 4),
      [spot(10, 0, 0.9, 2), spot(20, 0, 0.7, 1), spot(30, 0, 0.2, 8)],
      2,
      5,
    );
    expect(out.map((s) => s.rank)).toEqual([1, 2, 3, 4]);
    expect(out.map((s) => s.score)).toEqual([0.6, 0.6, 0.6, 0.2]);
    expect(out.map((s) => s.strength)).toEqual([1, 0.5, 0.25, 2]);
  });

  it("lists at most `max` spots", () => {
    const later = [1, 2, 3, 4, 5, 6].map((k) => spot(10 * k, 0, 0.5, 1));
    expect(withLaterSpots(spot(0, 0, 0.9, 1), later, 2, 5)).toHaveLength(5);
  });

  it("takes turns with the plain fit's own later spots, each once, so a wrong first spot keeps the plain fit's next", () => {
    const first = spot(0, 0, 0.9, 4);
    const plain = [first, spot(5, 0, 0.7, 3), spot(20, 0, 0.4, 1)];
    // the case-unit fit finds the leak at 12 m first, then again the plain fit's 5 m spot (within 2 m)
    const later = [spot(12, 0, 0.8, 2), spot(5.5, 0, 0.6, 1), spot(30, 0, 0.3, 1)];
    const out = withLaterSpots(first, later, 2, 5, plain);
    expect(out.map((s) => s.x)).toEqual([0, 12, 5, 20, 30]);
  });
});

describe("when the case-unit fit runs", () => {
  const square = (x0: number, y0: number, x1: number, y1: number) => [
    [x0, y0],
    [x1, y0],
    [x1, y1],
    [x0, y1],
  ];
  const grid = createPlanGrid(12, 8, 0.25, []);
  const plan = {
    width: 12,
    height: 8,
    fixtures: [
      { id: "case", kind: "open-case", polygon: square(1, 1, 5, 2), fans: true },
      { id: "room", kind: "walk-in", polygon: square(7, 4, 11, 7), fans: true },
    ],
    backgroundZones: [],
  } as never;
  const stage = (first: SuspectSpotFacts, extra: { passes?: boolean; oneReading?: boolean } = {}) => {
    const asked: Float32Array[] = [];
    const out = laterSpotsStage({
      plan,
      grid,
      stepScale: null,
      settings: LOCATOR_SETTINGS,
      plain: [first, spot(6, 3.5, 0.5, 1)],
      passes: extra.passes ?? false,
      oneReading: extra.oneReading ?? false,
      rerun: (scale) => {
        asked.push(scale);
        return [spot(10, 1, 0.6, 2)];
      },
    });
    return { out, asked };
  };

  it("where the cases run their fans: the plain first spot, then turns with the case-unit fit's", () => {
    const { out, asked } = stage(spot(2, 1.5, 0.8, 4));
    expect(out?.map((s) => [s.x, s.y])).toEqual([
      [2, 1.5],
      [10, 1],
      [6, 3.5],
    ]);
    expect(asked).toHaveLength(1);
  });

  it("leaves the plain list with pinpoint passes, a one-reading spot, or a first spot in a fan-stirred room", () => {
    expect(stage(spot(2, 1.5, 0.8, 4), { passes: true })).toEqual({ out: null, asked: [] });
    expect(stage(spot(2, 1.5, 0.8, 4), { oneReading: true })).toEqual({ out: null, asked: [] });
    expect(stage(spot(9, 5.5, 0.8, 4))).toEqual({ out: null, asked: [] });
  });
});
