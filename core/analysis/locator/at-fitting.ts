import type { LocatorInput } from "../../contracts/locator-input";

type RiskPoint = LocatorInput["plan"]["riskPoints"][number];

/**
 * The fitting (coil, valve, line-set drop) a spot stands on: the nearest risk point within `reachM` of
 * (x, y) whose own place `isAllowed`, or null. In a walk-in or machine room whose fans run the readings
 * are level all over the room, so the risk-point prior chose the spot's cell; the spot is then named at
 * the fitting itself rather than at the centre of a cell up to the prior's reach away from it.
 */
export function fittingAt(
  riskPoints: readonly RiskPoint[],
  x: number,
  y: number,
  reachM: number,
  isAllowed: (x: number, y: number) => boolean,
): RiskPoint | null {
  let best: RiskPoint | null = null;
  let bestD = reachM;
  for (const p of riskPoints) {
    const d = Math.hypot(p.x - x, p.y - y);
    if (d <= bestD && isAllowed(p.x, p.y)) {
      bestD = d;
      best = p;
    }
  }
  return best;
}
