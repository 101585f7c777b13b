import { describe, expect, it } from "vitest";
import { duplicateOffset } from "./duplicate-offset";
import { createScene } from "./scene";
import { openCase, rect, uuid, valve } from "./test-builders";

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
  it("steps a point aside", () => {
    const s = createScene(plan, [valve(3, 5, 5), valve(4, 19.8, 5)]);
    expect(duplicateOffset(s, [uuid(3)])).toEqual([0.5, 0]);
    expect(duplicateOffset(s, [uuid(4)])).toEqual([-0.5, 0]);
  });
});
