import type { LocatorDiagnostic } from "../../contracts/locator-output";
import { delayOfShift, secondsWords, statedDelayWords } from "./delay-words";
import { lengthRangeWords, lengthWords } from "./length-words";
import { formatShort } from "../numbers/number-format";
import type { WordsContext } from "./words-context";

const plural = (n: number, one: string, many: string) => (n === 1 ? one : many);

/** One diagnostic in plain words, with the reader's units and the plan's names. */
export function diagnosticWords(d: LocatorDiagnostic, ctx: WordsContext): string {
  const len = (m: number) => lengthWords(m, ctx.length, ctx.numbers);
  const ppm = (v: number) => `${formatShort(v, ctx.numbers)} ppm`;
  const name = (id: string, fallback: string) => ctx.name(id) ?? fallback;
  switch (d.kind) {
    case "fans-mixing":
      if (d.stilledByPass)
        return `${d.count} readings across ${name(d.fixtureId, "a fixture")} were level at about ${ppm(d.levelPpm)} while its fans ran: they mixed the gas. A still-air pass followed, and its readings place the spots.`;
      return `${d.count} readings across ${name(d.fixtureId, "a fixture")} are level at about ${ppm(d.levelPpm)}: its fans are mixing the gas. Stop the fans (or wait for defrost), let the air settle and sweep it again.`;
    case "benign-source":
      return `${d.count} ${plural(d.count, "reading", "readings")} near ${name(d.zoneId, "a benign-source zone")}${d.note ? ` (${d.note})` : ""}, up to ${ppm(d.peakPpm)}, ${plural(d.count, "is", "are")} explained by that benign-source zone and not counted as leak evidence.`;
    case "sparse-coverage":
      return `${d.count} ${plural(d.count, "gap between taps is", "gaps between taps are")} longer than ${len(d.gapM)} (longest ${len(d.longestM)}, around ${len(d.at.x)} across, ${len(d.at.y)} down). A leak there could be missed: walk those stretches again, tapping every ${lengthRangeWords(1.2, 1.5, ctx.length, ctx.numbers)}.`;
    case "one-sided-pass":
      return "The top suspect spot is seen from one pass only, so which side of the path it is on cannot be told: make a pass along the other face.";
    case "early-readings":
      return `${d.count} ${plural(d.count, "reading was", "readings were")} taken before one delay plus response time (${secondsWords(d.shiftS, ctx)}) had passed since their walk began (the sweep, a pinpoint pass, or a walk after a long pause) and ${plural(d.count, "is", "are")} placed at its first tap.`;
    case "over-range":
      return `${d.count} ${plural(d.count, "reading was", "readings were")} over range and counted as "at least" that value.`;
    case "delay-check": {
      const est = secondsWords(delayOfShift(d.estimatedS, ctx.timeConstantS), ctx);
      return (
        `The readings fit a ${est} delay better than ${statedDelayWords(d.statedS, ctx)} (passes over the same spots agree better)` +
        (d.used ? `, so the spots are placed with ${est}.` : ".") +
        " If this repeats, time the detector's delay again and update it."
      );
    }
    case "delay-uncertain": {
      const times = formatShort(d.plumePpm / d.alarmPpm, ctx.numbers);
      if (d.usedS !== null) {
        return `No spot fitted the readings (up to ${ppm(d.plumePpm)}, ${times} times the alarm) with ${statedDelayWords(d.statedS, ctx)} delay; the spots listed use ${secondsWords(delayOfShift(d.usedS, ctx.timeConstantS), ctx)}, with which they fit. Which delay is right is uncertain: check the detector's delay and sweep the spot again.`;
      }
      return `Readings reach ${ppm(d.plumePpm)}, ${times} times the alarm, yet no single spot explains them: this is not a clean sweep. ${capitalise(statedDelayWords(d.statedS, ctx))} delay may be wrong or the gas may come from several places; walk the area of the highest readings again slowly, in both directions.`;
    }
  }
}

type DelayUncertain = Extract<LocatorDiagnostic, { kind: "delay-uncertain" }>;

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * What to say when no spot is listed. A plume far above the alarm that fits no spot is never called
 * clean: the sentence says what is uncertain instead.
 */
export function noSpotWords(diagnostics: readonly { kind: string }[], ctx: WordsContext): string {
  const unsure = diagnostics.find((d): d is DelayUncertain => d.kind === "delay-uncertain");
  if (unsure) {
    return `No spot could be placed, but this is not a clean sweep: readings reach ${formatShort(unsure.plumePpm, ctx.numbers)} ppm, ${formatShort(unsure.plumePpm / unsure.alarmPpm, ctx.numbers)} times the alarm. See the diagnostics.`;
  }
  return "No credible leak: nothing stands out from the background on this sweep.";
}
