import type { DelayFacts } from "../../contracts/locator-output";
import { formatShort } from "../numbers/number-format";
import type { WordsContext } from "./words-context";

// The locator checks shifts (transport delay plus the sensor's time constant); people set the delay, so
// the words speak of the delay: shift minus the time constant of this analysis.

/** The transport delay that goes with a shift, s, to a tenth (never below 0). */
export function delayOfShift(shiftS: number, timeConstantS: number): number {
  return Math.max(0, Math.round((shiftS - timeConstantS) * 10) / 10);
}

export const secondsWords = (s: number, ctx: WordsContext) => `${formatShort(s, ctx.numbers)} s`;

/** "the detector's 5 s" or "the 10 s set for this map". */
export function statedDelayWords(statedShiftS: number, ctx: WordsContext): string {
  const s = secondsWords(delayOfShift(statedShiftS, ctx.timeConstantS), ctx);
  return ctx.delaySetByHand ? `the ${s} set for this map` : `the detector's ${s}`;
}

export interface DelayCheckWords {
  /** One line: "Readings fit a 6.5 s delay better than the detector's 5 s." */
  headline: string;
  /** What was done with it and what to do. */
  detail: string;
  /** The delay to offer for the detector, s; null when the readings do not clearly support another. */
  suggestedDelayS: number | null;
}

/** The delay check as the field map's panel and the sweep report show it. */
export function delayCheckWords(d: DelayFacts, ctx: WordsContext): DelayCheckWords {
  const stated = statedDelayWords(d.statedS, ctx);
  if (d.estimatedS === null) {
    return {
      headline: "The delay could not be checked on this sweep.",
      detail:
        "No two visits passed the same spot, so the readings cannot tell a right delay from a wrong one. Walking a stretch back the other way lets the next sweep check it.",
      suggestedDelayS: null,
    };
  }
  const estimated = delayOfShift(d.estimatedS, ctx.timeConstantS);
  const est = secondsWords(estimated, ctx);
  if (!d.supported) {
    return {
      headline: `Readings agree with ${stated} delay.`,
      detail:
        estimated === delayOfShift(d.statedS, ctx.timeConstantS)
          ? "Passes over the same spots agree best at that delay."
          : `Passes over the same spots agree best at ${est}, not clearly better than ${stated}, so the spots use ${stated}.`,
      suggestedDelayS: null,
    };
  }
  const used = secondsWords(delayOfShift(d.usedS, ctx.timeConstantS), ctx);
  return {
    headline: `Readings fit a ${est} delay better than ${stated}.`,
    detail:
      (d.usedS === d.estimatedS
        ? `Passes over the same spots agree better with ${est}, so the spots are placed with it.`
        : `Passes over the same spots agree better with ${est}; the spots use ${used} as set.`) +
      " A longer hose, a worn pump or a new probe changes a detector's delay: if this repeats, time the detector again and update it.",
    suggestedDelayS: estimated,
  };
}
