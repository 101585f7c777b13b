import { describe, expect, it } from "vitest";
import { settledOn } from "./guided";

// The guided policy's stop rule on hand-made marks: the last five marks within 0.6 m (the benchmark's
// found radius) of the latest one, each holding at least half the sites' weight within 0.6 m of it
// (decision 0164).
const at = (x: number, share: number) => ({ x, y: 1, share });

describe("settledOn", () => {
  it("settles on a mark alternating between two sites 0.45 m apart, either side of a leak", () => {
    expect(settledOn([at(3, 0.6), at(3.45, 0.55), at(3, 0.6), at(3.45, 0.55), at(3, 0.6)])).toBe(true);
  });

  it("does not settle on a still mark that holds too little of the weight", () => {
    expect(settledOn([at(3, 0.3), at(3, 0.3), at(3, 0.3), at(3, 0.3), at(3, 0.3), at(3, 0.3)])).toBe(false);
  });

  it("does not settle while the mark jumps farther than 0.6 m, nor on fewer than five marks", () => {
    expect(settledOn([at(3, 0.9), at(4, 0.9), at(4, 0.9), at(4, 0.9), at(4, 0.9)])).toBe(false);
    expect(settledOn([at(4, 0.9), at(4, 0.9), at(4, 0.9), at(4, 0.9)])).toBe(false);
    // three steady looks settled before decision 0164; now the search goes on
    expect(settledOn([at(3, 0.9), at(3, 0.9), at(3, 0.9)])).toBe(false);
  });

  it("does not settle when a look had no mark", () => {
    expect(settledOn([at(4, 0.9), null, ...Array.from({ length: 5 }, () => at(4, 0.9))])).toBe(true);
    expect(settledOn([at(4, 0.9), at(4, 0.9), at(4, 0.9), at(4, 0.9), null])).toBe(false);
    expect(settledOn([at(4, 0.9), at(4, 0.9), null, at(4, 0.9), at(4, 0.9)])).toBe(false);
  });
});
