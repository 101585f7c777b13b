import { describe, expect, it } from "vitest";
import { withPasses } from "./reading-passes";

describe("readings with their passes on the field map", () => {
  it("numbers each analysed reading by the pass its stored row names, the first pass 1", () => {
    const analysed = [{ readingId: "a" }, { readingId: "b" }, { readingId: "c" }, { readingId: "d" }];
    const stored = [
      { id: "a", passId: null },
      { id: "b", passId: "p2" },
      { id: "c", passId: "p3" },
    ];
    const passes = [
      { id: "p2", number: 2 },
      { id: "p3", number: 3 },
    ];
    expect(withPasses(analysed, stored, passes).map((r) => r.pass)).toEqual([1, 2, 3, 1]);
    // before the stored readings arrive, every reading is drawn as the first pass's
    expect(withPasses(analysed, undefined, passes).map((r) => r.pass)).toEqual([1, 1, 1, 1]);
  });
});
