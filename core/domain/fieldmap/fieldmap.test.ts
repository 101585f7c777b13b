import { describe, expect, it } from "vitest";
import { applySimilarity, similarityFromTwoPoints, IDENTITY } from "../../analysis/geometry/similarity";
import { CONCENTRATION_LUT, createConcentrationScale } from "./concentration-ramp";
import { differenceMap } from "./difference-map";
import type { FieldGridLike } from "./field-grid";
import { fixtureLevel } from "./fixture-levels";
import { HATCH_RGBA, renderFieldRgba } from "./render-field";

function grid(
  width: number,
  height: number,
  cellSize: number,
  f: (i: number, j: number) => number,
  conf = 1,
): FieldGridLike {
  const values = new Float32Array(width * height);
  const confidence = new Float32Array(width * height).fill(conf);
  for (let j = 0; j < height; j++) for (let i = 0; i < width; i++) values[j * width + i] = f(i, j);
  return { width, height, cellSize, values, confidence };
}

describe("difference map", () => {
  it("of a sweep with itself is zero at every cell", () => {
    const g = grid(40, 30, 0.25, (i, j) => Math.exp(-((i - 12) ** 2 + (j - 9) ** 2) / 20) * 180 + 0.4);
    const d = differenceMap(g, g, IDENTITY);
    for (let k = 0; k < d.values.length; k++) expect(d.values[k]).toBe(0);
    expect(d.maxAbs).toBe(0);
  });

  it("of a partly sampled sweep with itself is zero where known and unknown elsewhere", () => {
    const g = grid(10, 10, 0.5, (i) => (i < 5 ? 3 + i : NaN));
    const d = differenceMap(g, g, IDENTITY);
    for (let k = 0; k < 100; k++) {
      if (k % 10 < 5) expect(d.values[k]).toBe(0);
      else expect(Number.isNaN(d.values[k])).toBe(true);
    }
  });

  it("follows the alignment: a spike at the earlier version's matched point lands on the later version's", () => {
    // two matched points: earlier (2, 2) and (8, 2) are later (3, 4) and (9, 4) — a pure 1 m / 2 m shift
    const a1: [number, number] = [2, 2],
      a2: [number, number] = [8, 2];
    const b1: [number, number] = [3, 4],
      b2: [number, number] = [9, 4];
    const t = similarityFromTwoPoints(a1, a2, b1, b2);
    // the alignment maps both matched points exactly (hand-checked: scale 1, rotation 0, offset (1, 2))
    expect(applySimilarity(t, a1)[0]).toBeCloseTo(b1[0], 12);
    expect(applySimilarity(t, a1)[1]).toBeCloseTo(b1[1], 12);
    expect(applySimilarity(t, a2)[0]).toBeCloseTo(b2[0], 12);
    expect(applySimilarity(t, a2)[1]).toBeCloseTo(b2[1], 12);
    const earlier = grid(48, 32, 0.25, (i, j) => (i === 8 && j === 8 ? 100 : 0)); // cell holding (2.1, 2.1)
    const later = grid(48, 32, 0.25, () => 0);
    const d = differenceMap(earlier, later, t);
    // later − earlier is −100 exactly at the later cell holding b1 + 0.1 m, nowhere else
    const hit = 16 * 48 + 12;
    expect(d.values[hit]).toBe(-100);
    let others = 0;
    for (let k = 0; k < d.values.length; k++)
      if (k !== hit && d.values[k] !== 0 && !Number.isNaN(d.values[k])) others++;
    expect(others).toBe(0);
  });

  it("rotated and scaled versions still map the two matched points exactly", () => {
    const t = similarityFromTwoPoints([1, 1], [5, 3], [10, 2], [12, 10]);
    for (const [a, b] of [
      [
        [1, 1],
        [10, 2],
      ],
      [
        [5, 3],
        [12, 10],
      ],
    ] as const) {
      const m = applySimilarity(t, a);
      expect(m[0]).toBeCloseTo(b[0], 12);
      expect(m[1]).toBeCloseTo(b[1], 12);
    }
  });

  it("rejects mismatched arrays with the field named", () => {
    const g = grid(4, 4, 1, () => 0);
    expect(() => differenceMap({ ...g, values: new Float32Array(3) }, g, IDENTITY)).toThrow(/earlier\.values/);
  });
});

describe("field rendering", () => {
  it("paints known cells with the ramp and never paints unknown cells as clean air", () => {
    const scale = createConcentrationScale({ maxPpm: 100, log: false });
    const g = grid(12, 1, 0.25, (i) => (i < 6 ? 0 : NaN));
    const px = renderFieldRgba(g, { lut: CONCENTRATION_LUT, index: scale.index, hatch: 6 });
    const clean = scale.colour(0);
    expect([px[0], px[1], px[2]]).toEqual([...clean]);
    expect(px[3]).toBeGreaterThan(0);
    for (let i = 6; i < 12; i++) {
      const p = i * 4;
      const rgba = [px[p], px[p + 1], px[p + 2], px[p + 3]];
      // either a hatch stripe or see-through, and never the clean colour
      if (i % 6 === 0) expect(rgba).toEqual([...HATCH_RGBA]);
      else expect(rgba[3]).toBe(0);
    }
  });

  it("fades thinly sampled cells and hatches cells below the confidence floor", () => {
    const scale = createConcentrationScale({ maxPpm: 100, log: false });
    const g = grid(3, 1, 1, () => 50);
    g.confidence.set([1, 0.3, 0.05]);
    const px = renderFieldRgba(g, { lut: CONCENTRATION_LUT, index: scale.index, opacity: 200, hatch: 6 });
    expect(px[3]).toBe(200);
    expect(px[7]).toBeGreaterThan(0);
    expect(px[7]).toBeLessThan(200);
    expect(px[11]).toBe(0); // unknown, off the hatch stripe
  });
});

describe("fixture levels", () => {
  it("takes peak and mean of known cells inside the outline or within the margin", () => {
    // cells of 1 m; case outline x 2..4, y 2..3; margin 0.6 m reaches the cells centred 0.5 m outside
    const g = grid(8, 6, 1, (i, j) => i * 10 + j);
    const level = fixtureLevel(
      g,
      [
        [2, 2],
        [4, 2],
        [4, 3],
        [2, 3],
      ],
      0.6,
    )!;
    // centres inside or within 0.6 m: i ∈ {1,2,3,4}, j ∈ {1,2,3} but not the corners (distance 0.707)
    const cells = [
      [2, 1],
      [3, 1],
      [1, 2],
      [2, 2],
      [3, 2],
      [4, 2],
      [2, 3],
      [3, 3],
    ];
    const vals = cells.map(([i, j]) => i * 10 + j);
    expect(level.cells).toBe(cells.length);
    expect(level.peakPpm).toBe(Math.max(...vals));
    expect(level.meanPpm).toBeCloseTo(vals.reduce((a, b) => a + b, 0) / vals.length, 5);
    expect(
      fixtureLevel(
        grid(8, 6, 1, () => NaN),
        [
          [2, 2],
          [4, 2],
          [4, 3],
        ],
        0.5,
      ),
    ).toBeNull();
  });
});
