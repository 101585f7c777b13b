import { GeodesicSearch } from "../grid/geodesic-distance";
import { routeBetween } from "../grid/grid-path";
import type { PlanGrid } from "../grid/plan-grid";
import type { Route } from "./lag-correct";

/**
 * A Route for lagCorrect that walks around solid bodies: straight when the segment between two taps
 * is clear, the grid shortest path otherwise. Pure, so the Walk screen can use it too.
 */
export function gridRoute(grid: PlanGrid): Route {
  const search = new GeodesicSearch(grid);
  return (a, b) => {
    const straight = Math.hypot(b.x - a.x, b.y - a.y);
    return routeBetween(search, a.x, a.y, b.x, b.y, Math.max(10, 4 * straight));
  };
}
