import { describe, expect, it } from "vitest";
import { polygonArea, polygonCentroid, signedArea } from "./polygon-area";
import { pointInPolygon, pointInVertices, vertexArrays } from "./point-in-polygon";
import { distanceToSegment, isSelfIntersecting, lineIntersection, segmentsIntersect } from "./segments";
import { applySimilarity, invertSimilarity, similarityFromTwoPoints } from "./similarity";

describe("polygon area", () => {
  it("matches the shoelace worked example", () => {
    // Worked example of the shoelace formula (Wikipedia, "Shoelace formula"): (1,6),(3,1),(7,2),(4,4),(8,5) has area 16.5.
    expect(
      polygonArea([
        [1, 6],
        [3, 1],
        [7, 2],
        [4, 4],
        [8, 5],
      ]),
    ).toBeCloseTo(16.5, 12);
  });
  it("is signed by orientation and finds the centroid of a rectangle", () => {
    expect(
      signedArea([
        [0, 0],
        [2, 0],
        [2, 1],
        [0, 1],
      ]),
    ).toBe(2);
    expect(
      signedArea([
        [0, 0],
        [0, 1],
        [2, 1],
        [2, 0],
      ]),
    ).toBe(-2);
    expect(
      polygonCentroid([
        [0, 0],
        [4, 0],
        [4, 2],
        [0, 2],
      ]),
    ).toEqual([2, 1]);
  });
});

describe("point in polygon", () => {
  const l: [number, number][] = [
    [0, 0],
    [4, 0],
    [4, 1],
    [1, 1],
    [1, 4],
    [0, 4],
  ];
  it("handles a concave L shape", () => {
    expect(pointInPolygon([0.5, 3], l)).toBe(true);
    expect(pointInPolygon([3, 0.5], l)).toBe(true);
    expect(pointInPolygon([3, 3], l)).toBe(false);
    expect(pointInPolygon([-1, 0.5], l)).toBe(false);
  });
  it("on vertex arrays gives the same answer, also on edges and vertices, where either answer may come", () => {
    const v = vertexArrays(l);
    let inside = 0;
    // a 0.25 m lattice from -0.5 to 4.5 m puts points on every edge and vertex of the L
    for (let y = -0.5; y <= 4.5; y += 0.25)
      for (let x = -0.5; x <= 4.5; x += 0.25) {
        expect(pointInVertices(x, y, v)).toBe(pointInPolygon([x, y], l));
        if (pointInVertices(x, y, v)) inside++;
      }
    expect(inside).toBeGreaterThan(50);
  });
});

describe("segments", () => {
  it("finds crossings, touches and misses", () => {
    expect(segmentsIntersect([0, 0], [2, 2], [0, 2], [2, 0])).toBe(true);
    expect(segmentsIntersect([0, 0], [1, 0], [1, 0], [2, 5])).toBe(true);
    expect(segmentsIntersect([0, 0], [1, 0], [2, 0], [3, 0])).toBe(false);
    expect(segmentsIntersect([0, 0], [1, 1], [1, 0], [2, -1])).toBe(false);
    expect(lineIntersection([0, 0], [2, 2], [0, 2], [2, 0])).toEqual([1, 1]);
    expect(lineIntersection([0, 0], [1, 0], [0, 1], [1, 1])).toBeNull();
  });
  it("measures distance to a segment (3-4-5 triangle)", () => {
    expect(distanceToSegment([3, 4], [0, 0], [0, -5])).toBe(5);
    expect(distanceToSegment([1, 3], [0, 0], [2, 0])).toBe(3);
  });
  it("tells a bow-tie from a simple polygon", () => {
    expect(
      isSelfIntersecting([
        [0, 0],
        [2, 0],
        [0, 2],
        [2, 2],
      ]),
    ).toBe(true);
    expect(
      isSelfIntersecting([
        [0, 0],
        [2, 0],
        [2, 2],
        [0, 2],
      ]),
    ).toBe(false);
  });
});

describe("two-point similarity", () => {
  it("maps both matched points exactly and inverts", () => {
    const a1: [number, number] = [1, 2];
    const a2: [number, number] = [5, 2];
    const b1: [number, number] = [10, 10];
    const b2: [number, number] = [10, 18]; // rotated 90°, scaled ×2
    const t = similarityFromTwoPoints(a1, a2, b1, b2);
    expect(t.scale).toBeCloseTo(2, 12);
    expect(t.rotation).toBeCloseTo(Math.PI / 2, 12);
    const m1 = applySimilarity(t, a1);
    const m2 = applySimilarity(t, a2);
    expect(m1[0]).toBeCloseTo(10, 12);
    expect(m1[1]).toBeCloseTo(10, 12);
    expect(m2[0]).toBeCloseTo(10, 12);
    expect(m2[1]).toBeCloseTo(18, 12);
    const back = applySimilarity(invertSimilarity(t), m2);
    expect(back[0]).toBeCloseTo(5, 12);
    expect(back[1]).toBeCloseTo(2, 12);
  });
  it("refuses coincident points", () => {
    expect(() => similarityFromTwoPoints([1, 1], [1, 1], [0, 0], [1, 0])).toThrow(/coincide/);
  });
});
