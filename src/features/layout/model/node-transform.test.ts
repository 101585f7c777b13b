import { describe, expect, it } from "vitest";
import { bakeNodeTransform } from "./node-transform";
import { closeTo, rect } from "./test-builders";

describe("bakeNodeTransform", () => {
  it("is the identity at the origin with unit scale", () => {
    expect(bakeNodeTransform(rect(1, 2, 3, 1), { x: 0, y: 0, scaleX: 1, scaleY: 1, rotation: 0 })).toEqual(
      rect(1, 2, 3, 1),
    );
  });
  it("scales, then turns clockwise, then moves (a 90° turn sends +x to +y on the y-down plan)", () => {
    const out = bakeNodeTransform(
      [
        [1, 0],
        [0, 1],
      ],
      { x: 10, y: 5, scaleX: 2, scaleY: 3, rotation: 90 },
    );
    expect(
      closeTo(out, [
        [10, 7],
        [7, 5],
      ]),
    ).toBe(true);
  });
  it("refuses a collapsed scale", () => {
    expect(() => bakeNodeTransform(rect(0, 0, 1, 1), { x: 0, y: 0, scaleX: 0, scaleY: 1, rotation: 0 })).toThrow(
      /scale must not be 0/,
    );
  });
});
