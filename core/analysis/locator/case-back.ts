import type { LocatorInput } from "../../contracts/locator-input";
import { pointInPolygon } from "../geometry/point-in-polygon";
import { cellIndexOf, type PlanGrid } from "../grid/plan-grid";

type Fixture = LocatorInput["plan"]["fixtures"][number];

/**
 * The line along a display case's back, where its piping, coil joints and returns run and where a leak
 * in the case is usually found (common practice, no published source): `axis` 0 when the case runs
 * along x, 1 along y; `at` is the cross coordinate of the line. The back is the long side that stands
 * against a solid body (a wall, a lineup's spine); a case with no such side, or with both (an island's
 * wells on either side of its centre), has its back along the centre line. Null for fixtures that are
 * not display cases or are not drawn as an axis-aligned rectangle.
 */
export interface CaseBack {
  axis: 0 | 1;
  at: number;
  /** The case's extent along its axis. */
  from: number;
  to: number;
}

// How far in from the back panel the line is drawn, and how far outside a side is probed for a solid body, m.
const BACK_INSET_M = 0.15;
const PROBE_OUT_M = 0.1;

export function caseBack(fixture: Fixture, grid: PlanGrid): CaseBack | null {
  if (fixture.kind !== "open-case" && fixture.kind !== "door-case" && fixture.kind !== "island-case") return null;
  const xs = fixture.polygon.map((p) => p[0]);
  const ys = fixture.polygon.map((p) => p[1]);
  const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  const rectangle =
    fixture.polygon.length === 4 && fixture.polygon.every(([x, y]) => (x === x0 || x === x1) && (y === y0 || y === y1));
  if (!rectangle) return null;
  const axis: 0 | 1 = x1 - x0 >= y1 - y0 ? 0 : 1;
  const [a0, a1, c0, c1] = axis === 0 ? [x0, x1, y0, y1] : [y0, y1, x0, x1];
  // share of points just outside a long side that fall in solid cells
  const solidShare = (c: number) => {
    let solid = 0;
    const samples = 9;
    for (let k = 0; k < samples; k++) {
      const a = a0 + ((k + 0.5) / samples) * (a1 - a0);
      const [x, y] = axis === 0 ? [a, c] : [c, a];
      if (x < 0 || y < 0 || x >= grid.width * grid.cellSize || y >= grid.height * grid.cellSize) {
        solid++;
        continue;
      }
      if (grid.blocked[cellIndexOf(grid, x, y)]) solid++;
    }
    return solid / samples;
  };
  const low = solidShare(c0 - PROBE_OUT_M) >= 0.5;
  const high = solidShare(c1 + PROBE_OUT_M) >= 0.5;
  const at = low === high ? (c0 + c1) / 2 : low ? c0 + BACK_INSET_M : c1 - BACK_INSET_M;
  return { axis, at, from: a0, to: a1 };
}

/**
 * A spot inside a display case moved across the case to its back line, keeping its place along the case
 * (the readings, taken at the front, say where along the case the gas comes out, not how deep in it the
 * leak is). Null when the point is in no display case drawn as a rectangle.
 */
export function onCaseBack(
  fixtures: LocatorInput["plan"]["fixtures"],
  grid: PlanGrid,
  x: number,
  y: number,
): [number, number] | null {
  const fixture = fixtures.find((f) => pointInPolygon([x, y], f.polygon));
  const back = fixture ? caseBack(fixture, grid) : null;
  if (!back) return null;
  return back.axis === 0 ? [x, back.at] : [back.at, y];
}

/**
 * The first point on the segment from `back` toward `from`, in steps of `step`, that `isAllowed` accepts:
 * the cell a spot named on the back line takes when the back line's own cell is one the wall or spine
 * behind the case overlaps (the grid blocks every cell a solid body touches). Null when none is.
 */
export function allowedTowardFront(
  back: readonly [number, number],
  from: readonly [number, number],
  step: number,
  isAllowed: (x: number, y: number) => boolean,
): [number, number] | null {
  const length = Math.hypot(from[0] - back[0], from[1] - back[1]);
  const steps = Math.ceil(length / step);
  for (let k = 0; k <= steps; k++) {
    const f = steps === 0 ? 0 : k / steps;
    const x = back[0] + f * (from[0] - back[0]);
    const y = back[1] + f * (from[1] - back[1]);
    if (isAllowed(x, y)) return [x, y];
  }
  return null;
}
