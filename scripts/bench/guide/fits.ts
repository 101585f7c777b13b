// The locator run the guided policy reads after each reading, in two forms that must give the same
// guidance: the full analysis of every reading on the whole plan at the server's 0.25 m cells, and the
// live guide's windowed estimate at 0.5 m cells (core/analysis/guide/live-guide.ts, the code the phone
// runs), several times cheaper. `scripts/bench/guide-fits.ts` measures how often the two agree.
import { liveFit } from "#core/analysis/guide/live-guide";
import { locate } from "#core/analysis/locate";
import type { LocatorInput } from "#core/contracts/locator-input";
import type { CorrectedReading } from "#core/contracts/locator-output";

/** What the policy needs from a locator run, in plan coordinates. */
export interface GuideFit {
  /** The corrected readings the fit saw (plan coordinates). */
  corrected: CorrectedReading[];
  /** Position in `corrected` of the sweep's reading `i`, or -1 when the fit left it out. */
  indexOf: (i: number) => number;
  /** The suspect spots, best first (plan coordinates). */
  candidates: { x: number; y: number; radius: number }[];
}

export type Fitter = (input: LocatorInput) => GuideFit;

/** Every reading, the whole plan, the server's cells. */
export const fullFit: Fitter = (input) => {
  const result = locate(input);
  return { corrected: result.readings, indexOf: (i) => i, candidates: result.candidates };
};

/**
 * The live guide's window around the strongest alarm (evidence-window.ts) at its 0.5 m cells, moved
 * back to plan coordinates. When the window leaves out the alarm the search started from, `indexOf`
 * says so (-1) and the caller runs the full analysis instead.
 */
export const windowFit: Fitter = (input) => {
  const fit = liveFit(input);
  if (!fit.window) return fullFit(input);
  const { box, kept } = fit.window;
  const move = (p: { x: number; y: number }) => ({ x: p.x + box.x, y: p.y + box.y });
  const at = new Map(kept.map((sweepIndex, k) => [sweepIndex, k]));
  return {
    corrected: fit.corrected.map((r) => ({ ...r, raw: move(r.raw), corrected: move(r.corrected) })),
    indexOf: (i) => at.get(i) ?? -1,
    candidates: fit.candidates.map((c) => ({ ...move(c), radius: c.radius })),
  };
};
