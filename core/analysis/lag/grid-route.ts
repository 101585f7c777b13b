import { GeodesicSearch } from "../grid/geodesic-distance";
import { routeBetween } from "../grid/grid-path";
import type { PlanGrid } from "../grid/plan-grid";
import type { Route } from "./lag-correct";
import { rememberedByTap } from "./remembered-route";

// One route per grid: the delay check and the lag stage of every delay an analysis tries ask for the
// same legs between the same taps, so each leg is searched once and then shared (read only).
const routeOfGrid = new WeakMap<PlanGrid, Route>();

/**
 * A Route for lagCorrect that walks around solid bodies: straight when the segment between two taps
 * is clear, the grid shortest path otherwise. Pure, so the Walk screen can use it too. Legs already
 * found are remembered by their tap objects for as long as the grid and the taps live.
 */
export function gridRoute(grid: PlanGrid): Route {
  let route = routeOfGrid.get(grid);
  if (!route) {
    route = rememberedByTap(searchedRoute(grid));
    routeOfGrid.set(grid, route);
  }
  return route;
}

function searchedRoute(grid: PlanGrid): Route {
  const search = new GeodesicSearch(grid);
  return (a, b) => {
    const straight = Math.hypot(b.x - a.x, b.y - a.y);
    return routeBetween(search, a.x, a.y, b.x, b.y, Math.max(10, 4 * straight));
  };
}
