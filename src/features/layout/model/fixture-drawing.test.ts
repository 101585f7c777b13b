import { describe, expect, it } from "vitest";
import { doorGap, doorTicks, wallWithDoorGap } from "./fixture-drawing";
import { closeTo, rect } from "./test-builders";

describe("drawing geometry", () => {
  const box = rect(0, 0, 6, 4); // (0,0) (6,0) (6,4) (0,4)

  it("leaves the door gap open in a room's wall", () => {
    // Door on edge 2, from (6,4) towards (0,4): 2 m along, 1.2 m wide → gap from x=4 to x=2.8.
    const wall = wallWithDoorGap(box, { edge: 2, offset: 2, width: 1.2 });
    expect(wall.closed).toBe(false);
    const pts = [];
    for (let i = 0; i < wall.points.length; i += 2) pts.push([wall.points[i], wall.points[i + 1]]);
    expect(
      closeTo(pts, [
        [2.8, 4],
        [0, 4],
        [0, 0],
        [6, 0],
        [6, 4],
        [4, 4],
      ]),
    ).toBe(true);
    expect(
      closeTo(doorGap(box, { edge: 2, offset: 2, width: 1.2 })!, [
        [4, 4],
        [2.8, 4],
      ]),
    ).toBe(true);
  });
  it("draws a sealed room (no door yet) as a closed wall", () => {
    expect(wallWithDoorGap(box, null)).toEqual({ points: [0, 0, 6, 0, 6, 4, 0, 4], closed: true });
  });
  it("divides a glass-door case's longest edge into equal doors", () => {
    const ticks = doorTicks(rect(0, 0, 3, 1), 3);
    expect(ticks).toHaveLength(2);
    expect(
      closeTo(
        [ticks[0][0], ticks[1][0]],
        [
          [1, 0],
          [2, 0],
        ],
      ),
    ).toBe(true);
    // Each tick runs square into the case, half the 0.5 m from the edge to the centroid.
    expect(
      closeTo(
        [ticks[0][1], ticks[1][1]],
        [
          [1, 0.25],
          [2, 0.25],
        ],
      ),
    ).toBe(true);
    expect(doorTicks(rect(0, 0, 3, 1), 1)).toEqual([]);
  });
});
