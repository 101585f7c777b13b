import { describe, expect, it } from "vitest";
import { planPoint } from "../../../lib/plan-view/coordinates";
import { snapAngle, snapMove, snapPoint, snapToGrid } from "./snapping";
import { openCase, rect, uuid } from "./test-builders";

const neighbour = openCase(1, rect(10, 5, 2.4, 1.1));
const opts = { gridM: 0.5, toleranceM: 0.2, targets: [neighbour] };

describe("snapPoint", () => {
  it("prefers a vertex within tolerance", () => {
    expect(snapPoint(planPoint(12.3, 5.1), opts)).toEqual({
      point: planPoint(12.4, 5),
      kind: "vertex",
      targetId: uuid(1),
    });
  });
  it("falls back to the nearest point of an edge", () => {
    const s = snapPoint(planPoint(11, 5.15), opts);
    expect(s.kind).toBe("edge");
    expect(s.point).toEqual(planPoint(11, 5));
  });
  it("rounds to the grid when no fixture is near, and leaves the point alone with the grid off", () => {
    expect(snapPoint(planPoint(3.3, 7.8), opts)).toEqual({ point: planPoint(3.5, 8), kind: "grid", targetId: null });
    expect(snapPoint(planPoint(3.3, 7.8), { ...opts, gridM: null }).kind).toBe("none");
    expect(snapToGrid(0.29, 0.1)).toBe(0.3);
  });
  it("refuses a negative tolerance", () => {
    expect(() => snapPoint(planPoint(0, 0), { ...opts, toleranceM: -1 })).toThrow(/toleranceM/);
  });
});

describe("snapMove", () => {
  it("butts a dragged case against its neighbour's end and lines up the fronts", () => {
    // A 2.4 m case at x 5..7.4 dragged right by 2.5 m ends at 9.9, 0.1 m short of the neighbour at 10.
    const box = { minX: 5, minY: 5.12, maxX: 7.4, maxY: 6.22 };
    const s = snapMove(box, 2.5, 0, opts);
    expect(s.dx).toBeCloseTo(2.6, 12);
    expect(s.dy).toBeCloseTo(-0.12, 12);
    expect(s.guides).toEqual([
      { axis: "x", value: 10, targetId: uuid(1) },
      { axis: "y", value: 5, targetId: uuid(1) },
      { axis: "y", value: 6.1, targetId: uuid(1) },
    ]);
  });
  it("puts the box's corner on the grid when nothing is near", () => {
    const s = snapMove({ minX: 1.1, minY: 1.1, maxX: 2, maxY: 2 }, 0.7, 0, opts);
    expect(s.dx).toBeCloseTo(0.9, 12);
    expect(s.dy).toBeCloseTo(-0.1, 12);
    expect(s.guides).toEqual([]);
  });
});

describe("snapAngle", () => {
  it("rounds to 15° steps", () => {
    expect(snapAngle((50 * Math.PI) / 180)).toBeCloseTo((45 * Math.PI) / 180, 12);
  });
});
