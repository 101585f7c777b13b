import { describe, expect, it } from "vitest";
import { fittingAt } from "./at-fitting";

const points = [
  { id: "coil-1", kind: "coil" as const, x: 2, y: 1 },
  { id: "ls-1", kind: "line-set" as const, x: 2.4, y: 1 },
  { id: "valve-1", kind: "valve" as const, x: 5, y: 1 },
];
const anywhere = () => true;

describe("the fitting a spot stands on", () => {
  it("is the nearest risk point within reach", () => {
    expect(fittingAt(points, 2.125, 1.125, 0.625, anywhere)?.id).toBe("coil-1"); // 0.18 m against 0.32 m
    expect(fittingAt(points, 2.375, 0.875, 0.625, anywhere)?.id).toBe("ls-1");
  });

  it("is none when every risk point is farther than the reach, or where it stands is not allowed", () => {
    expect(fittingAt(points, 3.5, 1, 0.625, anywhere)).toBeNull(); // 1.1 m and 1.5 m away
    expect(fittingAt(points, 2.125, 1.125, 0.625, (x) => x !== 2)?.id).toBe("ls-1");
    expect(fittingAt(points, 2.125, 1.125, 0, anywhere)).toBeNull();
  });
});
