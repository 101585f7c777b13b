import interpolate from "@turf/interpolate";
import { featureCollection, point } from "@turf/helpers";
import { describe, expect, it } from "vitest";
import { idwAt, idwGrid } from "./idw-grid";

// Reference: @turf/interpolate 7.4.0 (general-purpose geospatial library), gridType "point", compared at
// the grid points turf itself places. Metres map to degrees at the equator with turf's earth radius
// (6371008.8 m), as in docs/reference/locator-methods.md §4.
const M_PER_DEG = (Math.PI * 6371008.8) / 180;
const deg = (m: number) => m / M_PER_DEG;

const xs = [0.3, 2.9, 1.7, 3.6];
const ys = [0.4, 0.6, 1.5, 1.9];
const ppm = [0, 12, 3, 40];
const readings = featureCollection(xs.map((x, k) => point([deg(x), -deg(ys[k])], { ppm: ppm[k] })));
const bbox: [number, number, number, number] = [0, -deg(2), deg(4), 0];

function turfPoints(weight?: number) {
  const base = { gridType: "point" as const, property: "ppm", units: "meters" as const, bbox };
  const grid = interpolate(readings, 0.5, weight === undefined ? base : { ...base, weight });
  return grid.features.map((f) => ({
    x: f.geometry.coordinates[0] * M_PER_DEG,
    y: -f.geometry.coordinates[1] * M_PER_DEG,
    v: f.properties!.ppm as number,
  }));
}

describe("IDW on an obstacle-free plan against @turf/interpolate", () => {
  it("equals turf's values with weight 2 (Shepard's p = 2)", () => {
    const ref = turfPoints(2);
    expect(ref.length).toBeGreaterThan(20);
    for (const p of ref) expect(idwAt(p.x, p.y, xs, ys, ppm, 2)).toBeCloseTo(p.v, 6);
  });

  it("turf's default weight is 1, not 2: the two differ and ours with p = 1 matches the default", () => {
    const ref1 = turfPoints();
    const diff = Math.max(...ref1.map((p) => Math.abs(idwAt(p.x, p.y, xs, ys, ppm, 2) - p.v)));
    expect(diff).toBeGreaterThan(0.5);
    for (const p of ref1) expect(idwAt(p.x, p.y, xs, ys, ppm, 1)).toBeCloseTo(p.v, 6);
  });

  it("returns the reading itself at a coinciding point, where turf gives NaN", () => {
    expect(idwAt(0.5, 0.5, [0.5, 1.9], [0.5, 0.5], [7, 1])).toBe(7);
    // put a reading exactly on one of turf's own grid points, then interpolate again on the same grid
    const first = interpolate(readings, 0.5, { gridType: "point", property: "ppm", units: "meters", weight: 2, bbox });
    const at = first.features[5].geometry.coordinates;
    const fc = featureCollection([...readings.features, point([at[0], at[1]], { ppm: 9 })]);
    const again = interpolate(fc, 0.5, { gridType: "point", property: "ppm", units: "meters", weight: 2, bbox });
    expect(Number.isNaN(again.features[5].properties!.ppm)).toBe(true);
    expect(
      idwAt(
        at[0] * M_PER_DEG,
        -at[1] * M_PER_DEG,
        [...xs, at[0] * M_PER_DEG],
        [...ys, -at[1] * M_PER_DEG],
        [...ppm, 9],
      ),
    ).toBe(9);
  });

  it("fills a row-major grid at cell centres and rejects mismatched inputs", () => {
    const g = idwGrid(3, 2, 1, xs, ys, ppm);
    expect(g[1 * 3 + 2]).toBeCloseTo(idwAt(2.5, 1.5, xs, ys, ppm), 12);
    expect(() => idwGrid(2, 2, 1, [1], [1, 2], [3])).toThrow(/same/);
  });
});
