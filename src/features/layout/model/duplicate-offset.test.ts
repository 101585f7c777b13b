import { describe, expect, it } from "vitest";
import { duplicateOffset } from "./duplicate-offset";
import { createScene } from "./scene";
import { openCase, rect, room, uuid, valve } from "./test-builders";

describe("where a duplicate lands", () => {
  const plan = { width: 20, height: 10 };
  it("butts the copy against the original's right end (the next case of a row)", () => {
    const s = createScene(plan, [openCase(1, rect(2, 2, 3.75, 1.1))]);
    expect(duplicateOffset(s, [uuid(1)])).toEqual([3.75, 0]);
  });
  it("goes below, then left, when the right side has no room", () => {
    const s = createScene(plan, [openCase(1, rect(17, 2, 3, 1)), openCase(2, rect(17, 9.5, 3, 0.5))]);
    expect(duplicateOffset(s, [uuid(1)])).toEqual([0, 1]);
    expect(duplicateOffset(s, [uuid(2)])).toEqual([-3, 0]);
  });
  it("goes where it covers no other fixture, the room it stands in aside", () => {
    // A case with a neighbour butted on its right and a wall below: the copy goes on its left.
    const s = createScene(plan, [
      room(9, rect(0, 0, 20, 10), null),
      openCase(1, rect(6, 2, 3, 1)),
      openCase(2, rect(9, 2, 3, 1)),
      openCase(3, rect(2, 3, 16, 0.3)),
    ]);
    expect(duplicateOffset(s, [uuid(1)])).toEqual([-3, 0]);
    // Neighbours on every side: the spot covering the fewest wins, right first on a tie.
    const boxed = createScene(plan, [
      openCase(1, rect(6, 2, 3, 1)),
      openCase(2, rect(9, 2, 3, 1)),
      openCase(3, rect(3, 2, 3, 1)),
      openCase(4, rect(6, 3, 3, 1)),
    ]);
    expect(duplicateOffset(boxed, [uuid(1)])).toEqual([0, -1]);
  });
  it("steps a point aside", () => {
    const s = createScene(plan, [valve(3, 5, 5), valve(4, 19.8, 5)]);
    expect(duplicateOffset(s, [uuid(3)])).toEqual([0.5, 0]);
    expect(duplicateOffset(s, [uuid(4)])).toEqual([-0.5, 0]);
  });
});
