import { describe, expect, it } from "vitest";
import { cellIndexOf, createPlanGrid } from "../grid/plan-grid";
import { caseUnitStepScale } from "./case-unit-scale";

const square = (x0: number, y0: number, x1: number, y1: number) => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];

describe("display cases with their fans running as mixed units", () => {
  const grid = createPlanGrid(10, 6, 0.25, []);
  const fixtures = [
    { id: "open", kind: "open-case", polygon: square(1, 1, 4, 2), fans: true },
    { id: "stilled", kind: "door-case", polygon: square(5, 1, 8, 2), fans: false },
    { id: "room", kind: "walk-in", polygon: square(1, 3, 4, 5), fans: true },
  ] as never;

  it("scales steps inside a fan-running case, not in a stilled one, and keeps the rooms' scale", () => {
    const base = new Float32Array(grid.width * grid.height).fill(1);
    const room = cellIndexOf(grid, 2, 4);
    base[room] = 0.35;
    const out = caseUnitStepScale(grid, { fixtures }, base, 0.5)!;
    expect(out[cellIndexOf(grid, 2.5, 1.5)]).toBeCloseTo(0.5, 6);
    expect(out[cellIndexOf(grid, 6.5, 1.5)]).toBe(1);
    expect(out[room]).toBeCloseTo(0.35, 6);
    expect(out[cellIndexOf(grid, 9, 5)]).toBe(1);
    // the base is not written to
    expect(base[cellIndexOf(grid, 2.5, 1.5)]).toBe(1);
  });

  it("is null when no display case runs its fans, and refuses a scale outside (0, 1]", () => {
    expect(caseUnitStepScale(grid, { fixtures: [fixtures[1], fixtures[2]] } as never, null, 0.5)).toBeNull();
    expect(() => caseUnitStepScale(grid, { fixtures }, null, 0)).toThrow(/case scale/);
  });
});
