import { describe, expect, it } from "vitest";
import type { PolygonFixture } from "#core/contracts/fixtures";
import { planPoint } from "../../../lib/plan-view/coordinates";
import {
  alignmentFromMatches,
  carryFixtures,
  mapBetweenVersions,
  mapToNextVersion,
  mapToPreviousVersion,
} from "./versioning";
import { closeTo, openCase, rect, room, uuid } from "./test-builders";

// The new drawing is at twice the scale, turned a quarter turn, and offset: the store's
// corners (1, 2) and (5, 2) on version 0 are at (30, 10) and (30, 18) on version 1.
const matches = { previous: [planPoint(1, 2), planPoint(5, 2)], next: [planPoint(30, 10), planPoint(30, 18)] } as const;

describe("versioning", () => {
  it("maps the two matched points exactly", () => {
    const t = alignmentFromMatches(matches);
    const a = mapToNextVersion(matches.previous[0], t);
    const b = mapToNextVersion(matches.previous[1], t);
    expect(a.x).toBeCloseTo(30, 12);
    expect(a.y).toBeCloseTo(10, 12);
    expect(b.x).toBeCloseTo(30, 12);
    expect(b.y).toBeCloseTo(18, 12);
    const back = mapToPreviousVersion(b, t);
    expect(back.x).toBeCloseTo(5, 12);
    expect(back.y).toBeCloseTo(2, 12);
  });

  it("carries fixtures with the same ids and mapped geometry, flagging any now off the plan", () => {
    const t = alignmentFromMatches(matches);
    const before = [
      openCase(1, rect(1, 2, 4, 1), "Deli 1"),
      room(2, rect(6, 3, 2, 2), { edge: 0, offset: 0.5, width: 1 }),
    ];
    const { fixtures, outside } = carryFixtures(before, t, { width: 40, height: 40 });
    expect(fixtures.map((f) => f.id)).toEqual([uuid(1), uuid(2)]);
    expect(fixtures[0].label).toBe("Deli 1");
    // (1,2)→(30,10), (5,2)→(30,18), (5,3)→(28,18), (1,3)→(28,10).
    expect(
      closeTo((fixtures[0] as PolygonFixture).polygon, [
        [30, 10],
        [30, 18],
        [28, 18],
        [28, 10],
      ]),
    ).toBe(true);
    expect(fixtures[1]).toMatchObject({ door: { edge: 0, offset: 1, width: 2 } });
    expect(outside).toEqual([]);
    // The room lands on x 24..28, the case on x 28..30: a 29 m wide plan leaves only the case sticking out.
    expect(carryFixtures(before, t, { width: 29, height: 40 }).outside).toEqual([uuid(1)]);
  });

  it("maps positions across several versions, both ways", () => {
    const t01 = alignmentFromMatches(matches);
    const t12 = alignmentFromMatches({
      previous: [planPoint(0, 0), planPoint(10, 0)],
      next: [planPoint(1, 1), planPoint(11, 1)],
    });
    const p = planPoint(3, 2.5);
    const direct = mapToNextVersion(mapToNextVersion(p, t01), t12);
    const via = mapBetweenVersions(p, [t01, t12], 0, 2);
    expect(via.x).toBeCloseTo(direct.x, 12);
    expect(via.y).toBeCloseTo(direct.y, 12);
    const back = mapBetweenVersions(via, [t01, t12], 2, 0);
    expect(back.x).toBeCloseTo(3, 12);
    expect(back.y).toBeCloseTo(2.5, 12);
    expect(() => mapBetweenVersions(p, [t01], 0, 2)).toThrow("to must be a version from 0 to 1, got 2");
  });

  it("refuses matched points that coincide", () => {
    expect(() =>
      alignmentFromMatches({ previous: [planPoint(1, 1), planPoint(1, 1)], next: [planPoint(0, 0), planPoint(1, 0)] }),
    ).toThrow(/coincide/);
  });
});
