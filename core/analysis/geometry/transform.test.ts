import { describe, expect, it } from "vitest";
import { clipPolygonToRect } from "./clip-to-rect";
import { polygonArea } from "./polygon-area";
import { mapBoxPoint, rotatePoint, rotatePolygon, translatePolygon } from "./transform";
import { feetToMetres, fromMetres, metresToFeet, toMetres } from "./units";

describe("units", () => {
  it("converts feet and metres exactly", () => {
    // NIST SP 811 (2008), B.8: 1 ft = 0.3048 m exactly.
    expect(feetToMetres(1)).toBe(0.3048);
    expect(feetToMetres(10)).toBeCloseTo(3.048, 15);
    expect(metresToFeet(3.048)).toBeCloseTo(10, 12);
    expect(toMetres(5, "m")).toBe(5);
    expect(fromMetres(0.3048, "ft")).toBe(1);
  });
});

describe("transforms", () => {
  it("rotates a quarter turn about a pivot", () => {
    // On a y-down plan a positive quarter turn sends +x to +y: (2,1) about (1,1) → (1,2).
    const [x, y] = rotatePoint([2, 1], [1, 1], Math.PI / 2);
    expect(x).toBeCloseTo(1, 12);
    expect(y).toBeCloseTo(2, 12);
    const r = rotatePolygon(
      [
        [0, 0],
        [2, 0],
        [2, 1],
        [0, 1],
      ],
      [1, 0.5],
      Math.PI,
    );
    expect(r[0][0]).toBeCloseTo(2, 12);
    expect(r[0][1]).toBeCloseTo(1, 12);
  });
  it("translates and maps between boxes", () => {
    expect(
      translatePolygon(
        [
          [0, 0],
          [1, 0],
          [1, 1],
        ],
        2,
        -1,
      ),
    ).toEqual([
      [2, -1],
      [3, -1],
      [3, 0],
    ]);
    const from = { minX: 0, minY: 0, maxX: 2, maxY: 1 };
    const to = { minX: 10, minY: 10, maxX: 14, maxY: 13 };
    expect(mapBoxPoint([1, 0.5], from, to)).toEqual([12, 11.5]);
    expect(mapBoxPoint([2, 1], from, to)).toEqual([14, 13]);
  });
});

describe("clipPolygonToRect", () => {
  it("cuts a square hanging over a corner down to the part inside", () => {
    const clipped = clipPolygonToRect(
      [
        [-1, -1],
        [1, -1],
        [1, 1],
        [-1, 1],
      ],
      10,
      10,
    );
    expect(polygonArea(clipped)).toBeCloseTo(1, 12);
    expect(clipped.every(([x, y]) => x >= 0 && y >= 0)).toBe(true);
  });
  it("keeps a polygon inside and drops one outside", () => {
    const tri: [number, number][] = [
      [1, 1],
      [3, 1],
      [2, 2],
    ];
    expect(clipPolygonToRect(tri, 10, 10)).toEqual(tri);
    expect(
      clipPolygonToRect(
        [
          [11, 1],
          [12, 1],
          [12, 2],
        ],
        10,
        10,
      ),
    ).toEqual([]);
  });
  it("clips a rotated square (diamond) against one side", () => {
    // A diamond of half-diagonal 1 centred on x = 0 loses exactly half its area (2 → 1).
    const clipped = clipPolygonToRect(
      [
        [0, 4],
        [1, 5],
        [0, 6],
        [-1, 5],
      ],
      10,
      10,
    );
    expect(polygonArea(clipped)).toBeCloseTo(1, 12);
  });
});
