import type { Polygon } from "../geometry/types";
import { createPlanGrid } from "../grid/plan-grid";
import { gridRoute } from "./grid-route";
import {
  lagCorrect,
  lagCorrectorInto,
  type LaggedArrays,
  type LaggedPosition,
  type Route,
  type Tap,
} from "./lag-correct";

// The one lag correction of a walk, used by the server's locator (locate.ts, step 1) and by the
// Walk screen's lag hint, so the hint marks the very point the field map will use. Pure TypeScript.

/**
 * Where each reading's air was sampled: back one delay plus the time constant along the walked route
 * (around solid bodies), stop-and-go at `walkSpeedMps` between taps (plain time interpolation when
 * it is 0 or absent).
 */
export function walkLag(
  taps: readonly Tap[],
  delayS: number,
  timeConstantS: number,
  route: Route | undefined,
  walkSpeedMps: number | undefined,
): LaggedPosition[] {
  return lagCorrect(taps, delayS, timeConstantS, {
    route,
    walkSpeedMps: walkSpeedMps !== undefined && walkSpeedMps > 0 ? walkSpeedMps : undefined,
  });
}

/** walkLag for many shifts of the same walk (the delay check's trial shifts), into arrays: the same positions. */
export function walkLagCorrectorInto(
  taps: readonly Tap[],
  route: Route | undefined,
  walkSpeedMps: number | undefined,
): (delayS: number, timeConstantS: number, out: LaggedArrays) => void {
  return lagCorrectorInto(taps, {
    route,
    walkSpeedMps: walkSpeedMps !== undefined && walkSpeedMps > 0 ? walkSpeedMps : undefined,
  });
}

/**
 * The walked route between taps on a plan, as the locator finds it: straight where clear, the grid
 * shortest path around solid bodies otherwise. Built once per plan (the raster of the solids is the
 * costly part); routes already found are remembered, so a walk of thousands of taps re-asks cheaply.
 */
export function planWalkRoute(
  plan: { width: number; height: number; obstacles: readonly { polygon: Polygon }[] },
  cellSize: number,
): Route {
  const route = gridRoute(
    createPlanGrid(
      plan.width,
      plan.height,
      cellSize,
      plan.obstacles.map((o) => o.polygon),
    ),
  );
  const seen = new Map<string, ReturnType<Route>>();
  return (a, b) => {
    const key = `${a.x},${a.y},${b.x},${b.y}`;
    if (!seen.has(key)) seen.set(key, route(a, b));
    return seen.get(key)!;
  };
}
