import { describe, expect, it } from "vitest";
import { firstByExplainedPeak } from "./first-spot";
import type { FoundSource } from "./greedy-sources";

// Sources over four readings: `q` times the kernel column is the share each explains at each reading.
const source = (cell: number, q: number, column: number[], more: Partial<FoundSource> = {}): FoundSource => ({
  cell,
  delta: 100,
  column: Float64Array.from(column),
  alternate: false,
  q,
  surface: new Float64Array(0),
  ...more,
});

describe("the first spot in still air", () => {
  it("is the source whose share explains the highest reading, not the strongest q", () => {
    const trail = source(1, 40, [0.1, 0.3, 0.3, 0.3]); // q 40, at most 12 ppm at any reading
    const leak = source(2, 30, [0.8, 0.2, 0, 0]); // q 30, 24 ppm at the first reading
    const far = source(3, 10, [0, 0, 0, 1]); // 10 ppm
    expect(firstByExplainedPeak([trail, leak, far], 3).map((s) => s.cell)).toEqual([2, 1, 3]);
  });

  it("keeps the list when the first already explains the highest reading, or only one source is fitted", () => {
    const a = source(1, 40, [1, 0, 0, 0]);
    const b = source(2, 30, [0, 0.5, 0, 0]);
    expect(firstByExplainedPeak([a, b], 3)).toEqual([a, b]);
    const alt = source(4, 50, [0, 0, 1, 0], { alternate: true });
    expect(firstByExplainedPeak([b, alt], 3)).toEqual([b, alt]);
  });

  it("looks only at the first `among` fitted sources and never moves up an alternative or a one-reading spot", () => {
    const a = source(1, 10, [1, 0, 0, 0]); // 10 ppm
    const alt = source(2, 90, [0, 1, 0, 0], { alternate: true }); // 90 ppm, an alternative
    const b = source(3, 12, [0, 0, 1, 0]); // 12 ppm
    const c = source(4, 50, [0, 0, 0, 1]); // 50 ppm, but the third fitted source
    expect(firstByExplainedPeak([a, alt, b, c], 2).map((s) => s.cell)).toEqual([3, 1, 2, 4]);
    const one = source(5, 99, [0, 0, 0, 1], { oneReading: true });
    expect(firstByExplainedPeak([a, one], 3)).toEqual([a, one]);
  });
});
