/**
 * Snapping in plan metres. The tolerance is a screen distance converted to metres by the
 * caller (coordinates.stageLengthToPlan(8, metresPerPixel, view)), so snapping feels the same
 * at every zoom. Fixture features win over the grid: lining a case up with its neighbour
 * matters more than a round number.
 */
import { polygonBounds } from "#core/analysis/geometry/bounds";
import type { Bounds, Vec } from "#core/analysis/geometry/types";
import type { Fixture } from "#core/contracts/fixtures";
import { planPoint, type PlanPoint } from "../../../lib/plan-view/coordinates";
import { fixtureVertices } from "./fixture-geometry";

export interface SnapOptions {
  /** Grid spacing in metres, or null when the grid is off. */
  gridM: number | null;
  /** How near (in metres) a vertex or edge must be to pull the point. */
  toleranceM: number;
  /** Fixtures to snap to; leave out the ones being moved or drawn. */
  targets: readonly Fixture[];
}

export type SnapKind = "vertex" | "edge" | "grid" | "none";

export interface PointSnap {
  point: PlanPoint;
  kind: SnapKind;
  /** The fixture snapped to, for vertex and edge snaps. */
  targetId: string | null;
}

function checkOptions(o: SnapOptions): void {
  if (!(Number.isFinite(o.toleranceM) && o.toleranceM >= 0))
    throw new RangeError("snap toleranceM must be 0 m or more");
  if (o.gridM !== null && !(Number.isFinite(o.gridM) && o.gridM > 0))
    throw new RangeError("snap gridM must be more than 0 m, or null");
}

export function snapToGrid(value: number, gridM: number): number {
  // Round the float noise of k × spacing (0.1 × 3 = 0.30000000000000004) to a clean value.
  return Number((Math.round(value / gridM) * gridM).toFixed(9));
}

function closestOnSegment(p: Vec, a: Vec, b: Vec): [number, number] {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2));
  return [a[0] + t * dx, a[1] + t * dy];
}

/** Snaps a point to the nearest vertex, else the nearest edge, within tolerance; else to the grid. */
export function snapPoint(p: PlanPoint, options: SnapOptions): PointSnap {
  checkOptions(options);
  const q: Vec = [p.x, p.y];
  let best: PointSnap | null = null;
  let bestD = options.toleranceM;
  for (const f of options.targets) {
    for (const [x, y] of fixtureVertices(f)) {
      const d = Math.hypot(x - q[0], y - q[1]);
      if (d <= bestD) [best, bestD] = [{ point: planPoint(x, y), kind: "vertex", targetId: f.id }, d];
    }
  }
  if (best) return best;
  for (const f of options.targets) {
    if ("point" in f) continue;
    const poly = f.polygon;
    for (let i = 0; i < poly.length; i++) {
      const [x, y] = closestOnSegment(q, poly[i], poly[(i + 1) % poly.length]);
      const d = Math.hypot(x - q[0], y - q[1]);
      if (d <= bestD) [best, bestD] = [{ point: planPoint(x, y), kind: "edge", targetId: f.id }, d];
    }
  }
  if (best) return best;
  if (options.gridM !== null)
    return {
      point: planPoint(snapToGrid(p.x, options.gridM), snapToGrid(p.y, options.gridM)),
      kind: "grid",
      targetId: null,
    };
  return { point: p, kind: "none", targetId: null };
}

/** A line the moved box lined up with, for the view to draw as a guide. */
export interface SnapGuide {
  axis: "x" | "y";
  value: number;
  targetId: string | null;
}

export interface MoveSnap {
  dx: number;
  dy: number;
  guides: SnapGuide[];
}

/**
 * Adjusts a drag (dx, dy) of a selection with bounding box `box` so that, on each axis, one of
 * the moved box's sides lines up with a vertex coordinate of another fixture (which covers
 * butting a case against its neighbour's end and aligning a row's fronts), within tolerance;
 * otherwise the box's top-left corner goes to the grid. Axes snap independently.
 */
export function snapMove(box: Bounds, dx: number, dy: number, options: SnapOptions): MoveSnap {
  checkOptions(options);
  const guides: SnapGuide[] = [];
  const axis = (name: "x" | "y", d: number, min: number, max: number): number => {
    const matches: { shift: number; guide: SnapGuide }[] = [];
    for (const f of options.targets) {
      const b = polygonBounds(fixtureVertices(f));
      for (const target of name === "x" ? [b.minX, b.maxX] : [b.minY, b.maxY]) {
        for (const side of [min + d, max + d]) {
          if (Math.abs(target - side) <= options.toleranceM)
            matches.push({ shift: target - side, guide: { axis: name, value: target, targetId: f.id } });
        }
      }
    }
    if (matches.length === 0) return options.gridM === null ? d : snapToGrid(min + d, options.gridM) - min;
    const shift = matches.reduce((a, m) => (Math.abs(m.shift) < Math.abs(a) ? m.shift : a), Infinity);
    // Every line the snapped box now touches gets a guide (same-depth cases align front and back).
    for (const m of matches) if (Math.abs(m.shift - shift) < 1e-9) guides.push(m.guide);
    return d + shift;
  };
  return { dx: axis("x", dx, box.minX, box.maxX), dy: axis("y", dy, box.minY, box.maxY), guides };
}

/** Rounds an angle (radians) to the nearest multiple of `stepDegrees` (a held Shift while rotating). */
export function snapAngle(angle: number, stepDegrees = 15): number {
  const step = (stepDegrees * Math.PI) / 180;
  return Math.round(angle / step) * step;
}
