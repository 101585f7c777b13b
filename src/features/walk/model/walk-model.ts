import type { Fixture } from "#core/contracts/fixtures";
import { DEFAULT_LOCATOR_OPTIONS } from "#core/analysis/locator/locator-options";
import { planWalkRoute } from "#core/analysis/lag/walk-lag";
import { toLocatorPlan } from "#core/domain/layout/to-locator-input";
import { DEFAULT_CELL_SIZE_M } from "#core/contracts/locator-input";
import type { WalkModel } from "./lag-hint";

/**
 * The route and pace the server's locator assumes between taps, for the plan on this device: the
 * same solid bodies (and room walls), the same grid cell size and the same walking pace. Build it
 * once per plan; it answers each leg of the walk from then on.
 */
export function walkModelFor(
  plan: { widthM: number | null; heightM: number | null },
  fixtures: readonly Fixture[],
): WalkModel {
  const walkSpeedMps = DEFAULT_LOCATOR_OPTIONS.walkSpeedMps;
  if (!(plan.widthM && plan.heightM)) return { walkSpeedMps };
  // Fans do not matter for the route; only the solids and walls do.
  const locatorPlan = toLocatorPlan({ width: plan.widthM, height: plan.heightM }, fixtures, { fansRunning: true });
  return { route: planWalkRoute(locatorPlan, DEFAULT_CELL_SIZE_M), walkSpeedMps };
}
