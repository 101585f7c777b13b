import { describe, expect, it } from "vitest";
import type { Fixture } from "#core/contracts/fixtures";
import { fixtureAt, unsampledFixtures } from "./coverage";
import { enteredRoom } from "./room-entry";

const rect = (x: number, y: number, w: number, h: number): [number, number][] => [
  [x, y],
  [x + w, y],
  [x + w, y + h],
  [x, y + h],
];
const base = { label: "", systemId: null, hasFans: true };
const fixtures: Fixture[] = [
  {
    ...base,
    id: "11111111-1111-4111-8111-111111111111",
    kind: "open-case",
    label: "Dairy 1",
    polygon: rect(2, 8, 4, 1),
  },
  {
    ...base,
    id: "22222222-2222-4222-8222-222222222222",
    kind: "open-case",
    label: "Dairy 2",
    polygon: rect(6, 8, 4, 1),
  },
  { ...base, id: "33333333-3333-4333-8333-333333333333", kind: "gondola", polygon: rect(2, 12, 8, 1) },
  {
    ...base,
    id: "44444444-4444-4444-8444-444444444444",
    kind: "walk-in-cooler",
    label: "Dairy walk-in",
    polygon: rect(2, 1, 6, 5),
    door: null,
  },
  { ...base, id: "55555555-5555-4555-8555-555555555555", kind: "valve", point: { x: 12, y: 3 } },
];

describe("coverage while walking", () => {
  it("marks air volumes and points no reading came within 1 m of; solid bodies never count", () => {
    const left = unsampledFixtures(fixtures, [
      { x: 4, y: 9.5 },
      { x: 12.5, y: 3.5 },
    ]);
    expect(left.map((f) => f.label || f.kind)).toEqual(["Dairy 2", "Dairy walk-in"]);
    expect(unsampledFixtures(fixtures, [{ x: 4, y: 10.1 }]).map((f) => f.label)).toContain("Dairy 1"); // 1.1 m away
  });

  it("finds the fixture a leak is marked on: inside first, else the nearest within reach", () => {
    expect(fixtureAt(fixtures, 3, 3)?.label).toBe("Dairy walk-in");
    expect(fixtureAt(fixtures, 7, 9.6)?.label).toBe("Dairy 2");
    expect(fixtureAt(fixtures, 20, 20)).toBeNull();
  });

  it("shows the room caution on entering a walk-in, not on every tap inside it", () => {
    expect(enteredRoom(fixtures, { x: 4, y: 9.5 }, { x: 3, y: 3 })).toMatchObject({ place: "walk-in" });
    expect(enteredRoom(fixtures, { x: 3, y: 3 }, { x: 4, y: 4 })).toBeNull();
    expect(enteredRoom(fixtures, null, { x: 4, y: 9.5 })).toBeNull();
  });
});
