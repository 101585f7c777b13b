import type { LocatorInput } from "../../contracts/locator-input";
import { DRIFT_DIRECTIONS, driftedKernel } from "../locator/local-drift";
import { casesRunFans } from "../locator/plan-masks";
import { LOCATOR_SETTINGS } from "../locator/settings";

// Where case fans stir the air, a drift carries a leak's gas along the lineup: the readings rise sharply
// at the leak and stay level for metres downwind (decision 0128). A site weighed with a symmetric kernel
// sits in the middle of that plateau; weighed with a drifted one, at its upwind edge (decision 0149).

/** One drifted kernel: g(d, Δ) for a reading at straight distance d and displacement Δ from the site. */
export interface DriftKernel {
  a: readonly [number, number];
  at: (d: number, dx: number, dy: number) => number;
}

/** The drifts a site may take, and the bar (χ², untempered) a drift must clear over none. */
export interface DriftChoice {
  kernels: readonly DriftKernel[];
  penalty: number;
}

/**
 * The strengths |a| tried (1/m): the two weaker of the locator's upwind placement (settings.ts
 * `upwindStrengths`); with 2 per metre, a site behind a few weak readings explained readings rising
 * away from it (single-fans-6001, tried on stores 6001-6010).
 */
export const DRIFT_STRENGTHS: readonly number[] = [0.4, 1];
/** Two more parameters per site: a drift must beat none by this much χ² (4 let drifts explain noise; tried on 6001-6010). */
export const DRIFT_PENALTY = 8;

const built = new Map<string, DriftKernel[]>();

/** Every strength in the eight directions, on the guide's kernel (built once per set, a few tables). */
export function driftKernels(strengths: readonly number[] = DRIFT_STRENGTHS): DriftKernel[] {
  const key = strengths.join(",");
  const known = built.get(key);
  if (known) return known;
  const k = LOCATOR_SETTINGS.kernel;
  const kernels = strengths.flatMap((s) =>
    DRIFT_DIRECTIONS.map(([ux, uy]): DriftKernel => {
      const a = [s * ux, s * uy] as const;
      return { a, at: driftedKernel(k.screeningLengthM, k.nearCutoffM, k.truncationM, a) };
    }),
  );
  built.set(key, kernels);
  return kernels;
}

/** The drifts the evidence search may weigh sites with on this plan: none unless most cases run fans. */
export function driftChoiceFor(
  plan: LocatorInput["plan"],
  penalty = DRIFT_PENALTY,
  strengths: readonly number[] = DRIFT_STRENGTHS,
): DriftChoice | undefined {
  if (strengths.length === 0 || !casesRunFans(plan.fixtures)) return undefined;
  return { kernels: driftKernels(strengths), penalty };
}
