import type { Route, Tap } from "./lag-correct";

/**
 * A route that remembers each leg by its tap objects: every trial shift and every delay tried asks
 * for the same legs between the same taps (a string key per call cost more than the search it saved).
 */
export function rememberedByTap(route: Route): Route {
  const legs = new WeakMap<Tap, { to: Tap; route: ReturnType<Route> }[]>();
  return (a, b) => {
    let from = legs.get(a);
    if (!from) legs.set(a, (from = []));
    for (const leg of from) if (leg.to === b) return leg.route;
    const found = route(a, b);
    from.push({ to: b, route: found });
    return found;
  };
}
