import { describe, expect, it } from "vitest";
import type { Fixture } from "#core/contracts/fixtures";
import { roomSystemIds } from "./room-entry";

const rect = (x0: number, y0: number, x1: number, y1: number): [number, number][] => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];

describe("the systems in a room (for its cautions)", () => {
  it("are the room's own system and those of fixtures inside it, not outside", () => {
    const fixtures = [
      { id: "room", kind: "machine-room", label: "", systemId: null, hasFans: true, polygon: rect(0, 0, 10, 8) },
      { id: "rack", kind: "rack", label: "", systemId: "s-nh3", hasFans: true, polygon: rect(1, 1, 3, 2) },
      { id: "valve", kind: "valve", label: "", systemId: "s-co2", point: { x: 5, y: 5 } },
      { id: "case", kind: "display-case", label: "", systemId: "s-out", hasFans: true, polygon: rect(12, 1, 14, 2) },
    ] as unknown as Fixture[];
    expect(roomSystemIds(fixtures, fixtures[0]).sort()).toEqual(["s-co2", "s-nh3"]);
  });
});
