import { describe, expect, it } from "vitest";
import { cellIndexOf, createPlanGrid } from "../grid/plan-grid";
import { allowedTowardFront, caseBack, onCaseBack } from "./case-back";

// A 10 m x 6 m plan of 0.25 m cells with a wall along y = 0..0.3 and a 0.15 m spine at x = 6..6.15.
const wall: [number, number][] = [
  [0, 0],
  [10, 0],
  [10, 0.3],
  [0, 0.3],
];
const spine: [number, number][] = [
  [6, 2],
  [6.15, 2],
  [6.15, 6],
  [6, 6],
];
const grid = createPlanGrid(10, 6, 0.25, [wall, spine]);
const rect = (x0: number, y0: number, x1: number, y1: number): [number, number][] => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];

describe("the back of a display case", () => {
  it("is 0.15 m in from the long side against a wall (a wall case)", () => {
    const back = caseBack({ id: "c1", kind: "open-case", polygon: rect(1, 0.3, 4, 1.3), fans: true }, grid);
    expect(back).toMatchObject({ axis: 0, from: 1, to: 4 });
    expect(back?.at).toBeCloseTo(0.45, 9);
  });

  it("is on the spine's side of a lineup case running along y", () => {
    const back = caseBack({ id: "c2", kind: "door-case", polygon: rect(5, 2.5, 6, 5.5), fans: false }, grid);
    expect(back?.axis).toBe(1);
    expect(back?.at).toBeCloseTo(5.85, 9);
  });

  it("is the centre line of an island case with no solid side", () => {
    const back = caseBack({ id: "i1", kind: "island-case", polygon: rect(1, 3, 4, 4.6), fans: true }, grid);
    expect(back?.axis).toBe(0);
    expect(back?.at).toBeCloseTo(3.8, 9);
  });

  it("is not drawn for walk-ins, machine rooms or cases that are not rectangles", () => {
    expect(caseBack({ id: "w", kind: "walk-in", polygon: rect(1, 3, 4, 5), fans: true }, grid)).toBeNull();
    const lShape: [number, number][] = [
      [1, 3],
      [4, 3],
      [4, 4],
      [2, 4],
      [2, 5],
      [1, 5],
    ];
    expect(caseBack({ id: "l", kind: "open-case", polygon: lShape, fans: true }, grid)).toBeNull();
  });

  it("moves a spot in a case across to the back line, keeping its place along the case", () => {
    const fixtures = [
      { id: "c1", kind: "open-case" as const, polygon: rect(1, 0.3, 4, 1.3), fans: true },
      { id: "w", kind: "walk-in" as const, polygon: rect(7, 0.3, 9, 2), fans: true },
    ];
    const [x, y] = onCaseBack(fixtures, grid, 2.375, 1.125)!;
    expect(x).toBe(2.375);
    expect(y).toBeCloseTo(0.45, 9);
    expect(onCaseBack(fixtures, grid, 8, 1)).toBeNull(); // a walk-in has no case back
    expect(onCaseBack(fixtures, grid, 5, 1)).toBeNull(); // in no fixture
  });

  it("takes the first free cell toward the front when the wall behind the case blocks the back line's cell", () => {
    // the wall case's back line (y 0.45) lies in the cell row 0.25-0.5 m, which the wall (to 0.3 m) blocks
    const free = (x: number, y: number) => grid.blocked[cellIndexOf(grid, x, y)] === 0;
    expect(free(2, 0.45)).toBe(false);
    const at = allowedTowardFront([2, 0.45], [2, 0.875], 0.125, free);
    expect(at?.[0]).toBe(2);
    expect(Math.floor(at![1] / 0.25)).toBe(2); // the next row, 0.5-0.75 m
    expect(allowedTowardFront([2, 0.45], [2, 0.875], 0.125, () => false)).toBeNull();
    expect(allowedTowardFront([2, 0.875], [2, 0.875], 0.125, free)).toEqual([2, 0.875]); // the back line is free
  });
});
