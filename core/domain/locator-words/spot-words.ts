import type { SpotNextCheck, SpotReason, SuspectSpotFacts } from "../../contracts/locator-output";
import { lengthWords } from "./length-words";
import { massPerYearWords } from "./mass-words";
import { formatGrouped, formatShort } from "../numbers/number-format";
import { spotRefrigerantName, type SpotRefrigerant } from "./spot-refrigerant";
import { fixtureWords, riskPointWords, type WordsContext } from "./words-context";

/** Why this spot, in plain words. */
export function spotReasonWords(r: SpotReason, ctx: WordsContext): string {
  const len = (m: number) => lengthWords(m, ctx.length, ctx.numbers);
  const ppm = (v: number) => `${formatShort(v, ctx.numbers)} ppm`;
  const fixture = r.fixture ? fixtureWords(ctx, r.fixture.id, r.fixture.kind) : null;
  const where = !r.fixture
    ? "in open floor"
    : r.fixture.distanceM === 0
      ? `inside ${fixture}`
      : `${len(r.fixture.distanceM)} from ${fixture}`;
  const lead =
    r.kind === "alternative"
      ? `Alternative spot ${where}: the readings fit a source here almost as well as at a higher-ranked spot`
      : r.kind === "one-reading"
        ? `One reading at ${ppm(r.peakPpm)} against a background of ${ppm(r.backgroundPpm)}, ${where}, and no other reading nearby rises with it: too little to fit a source, too much to call the sweep clean, so re-check around it`
        : `${r.supportCount} readings nearby rise to ${ppm(r.peakPpm)} against a background of ${ppm(r.backgroundPpm)}; one source ${where} explains them best`;
  // one reading is from one pass by nature; its next checks already say to walk the other face
  return r.oneSided && r.kind !== "one-reading"
    ? `${lead}. The readings come from one pass, so the side of the path is uncertain.`
    : `${lead}.`;
}

function nextCheckPart(c: SpotNextCheck, ctx: WordsContext): string {
  const len = (m: number) => lengthWords(m, ctx.length, ctx.numbers);
  switch (c.kind) {
    case "risk-point-first":
      return `look at ${riskPointWords(ctx, c.riskPointId, c.riskPointKind)} (${len(c.distanceM)} away) first`;
    case "stop-fans":
      return `stop the fans of ${ctx.name(c.fixtureId) ?? "this fixture"} (or wait for defrost), then re-check every ${len(c.spacingM)} within ${len(c.withinM)} of this spot`;
    case "grid-recheck":
      return `re-check every ${len(c.spacingM)} within ${len(c.withinM)} of this spot, probe slow and close to joints`;
    case "other-face":
      return "make a pass along the other face to tell which side the leak is on";
  }
}

/** The checks to make next, in order, as one sentence. */
export function nextCheckWords(checks: readonly SpotNextCheck[], ctx: WordsContext): string {
  const text = checks.map((c) => nextCheckPart(c, ctx)).join("; ");
  return text.charAt(0).toUpperCase() + text.slice(1) + ".";
}

/** Grams per year of the spot's emission in its refrigerant (ppm are mole fractions: mol × g/mol). */
export function gramsPerYear(spot: Pick<SuspectSpotFacts, "molPerYear">, refrigerant: SpotRefrigerant): number {
  return spot.molPerYear * refrigerant.molarMassGPerMol;
}

/** "0.45 of the strongest, about 32 kg/yr of R-448A if well mixed" */
export function strengthWords(
  spot: Pick<SuspectSpotFacts, "strength" | "molPerYear">,
  refrigerant: SpotRefrigerant,
  ctx: WordsContext,
): string {
  const share = `${formatGrouped(spot.strength, ctx.numbers, 2)} of the strongest`;
  if (!Number.isFinite(spot.molPerYear)) return share;
  const mass = massPerYearWords(gramsPerYear(spot, refrigerant), ctx.mass, ctx.numbers);
  const name = spotRefrigerantName(refrigerant);
  const which =
    refrigerant.source === "default"
      ? `${name}, assumed`
      : refrigerant.molarMassAssumedFrom
        ? `${name}, weighed as ${refrigerant.molarMassAssumedFrom}`
        : name;
  return `${share}, about ${mass} of ${which} if well mixed`;
}

/** "12.1 m across, 3.3 m down, within 2.5 m" */
export function whereWords(spot: Pick<SuspectSpotFacts, "x" | "y" | "radius">, ctx: WordsContext): string {
  const len = (m: number) => lengthWords(m, ctx.length, ctx.numbers);
  return `${len(spot.x)} across, ${len(spot.y)} down, within ${len(spot.radius)}`;
}
