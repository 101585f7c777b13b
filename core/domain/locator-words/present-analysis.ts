import type { AnalysisDiagnostic, SuspectSpotWithRefrigerant } from "../../contracts/analysis";
import { cautionRefrigerant } from "./spot-refrigerant";
import type { DelayFacts, LocatorAssumptions } from "../../contracts/locator-output";
import type { LengthPreference, MassPreference } from "../units/format-units";
import { assumptionWords } from "./assumption-words";
import { delayCheckWords, type DelayCheckWords } from "./delay-words";
import { diagnosticWords, noSpotWords } from "./diagnostic-words";
import { DEFAULT_NUMBER_FORMAT, type NumberFormat } from "../numbers/number-format";
import { nextCheckWords, spotReasonWords, strengthWords, whereWords } from "./spot-words";
import type { WordsContext } from "./words-context";
import { cautionsFor, type CautionId, type CautionPlace } from "../safety/cautions";

/**
 * The one presenter of an analysis: the field map, the sweep report PDF and the report e-mail all word
 * the locator's facts here, in the reader's units and number style, with the names on the plan.
 */

export interface PresentedSpot {
  rank: number;
  /** The nearest fixture's name, or "Open floor". */
  place: string;
  where: string;
  reason: string;
  nextCheck: string;
  strength: string;
  /** The nearest risk point's name, or "none near". */
  riskPoint: string;
  /** What can hurt someone checking this spot: its refrigerant (flammable, CO2, ammonia) and a closed room. */
  cautions: string[];
}

export interface PresentedDiagnostic {
  kind: AnalysisDiagnostic["kind"];
  text: string;
}

export interface PresentedAnalysis {
  spots: PresentedSpot[];
  /** What to say when no spot is listed (never "clean" for a plume far above the alarm); null when spots are listed. */
  noSpot: string | null;
  diagnostics: PresentedDiagnostic[];
  assumptions: string[];
  delay: DelayCheckWords;
}

export interface AnalysisFacts {
  candidates: readonly SuspectSpotWithRefrigerant[];
  diagnostics: readonly AnalysisDiagnostic[];
  assumptions: LocatorAssumptions;
  delay: DelayFacts;
  params: { timeConstantS: number };
}

export interface ReaderSettings {
  length: LengthPreference;
  mass: MassPreference;
  numbers?: NumberFormat;
  /** Fixture id → the name on the plan (an empty name counts as none). */
  names: ReadonlyMap<string, string>;
  delaySetByHand: boolean;
}

export function wordsContext(r: ReaderSettings, timeConstantS: number): WordsContext {
  return {
    length: r.length,
    mass: r.mass,
    numbers: r.numbers ?? DEFAULT_NUMBER_FORMAT,
    name: (id) => r.names.get(id) || null,
    timeConstantS,
    delaySetByHand: r.delaySetByHand,
  };
}

export function presentAnalysis(a: AnalysisFacts, reader: ReaderSettings): PresentedAnalysis {
  const ctx = wordsContext(reader, a.params.timeConstantS);
  return {
    spots: a.candidates.map((c) => ({
      rank: c.rank,
      place: (c.fixtureId && ctx.name(c.fixtureId)) || "Open floor",
      where: whereWords(c, ctx),
      reason: spotReasonWords(c.reason, ctx),
      nextCheck: nextCheckWords(c.nextChecks, ctx),
      strength: strengthWords(c, c.refrigerant, ctx),
      riskPoint: (c.riskPointId && ctx.name(c.riskPointId)) || "none near",
      cautions: spotCautions(c),
    })),
    noSpot: a.candidates.length === 0 ? noSpotWords(a.diagnostics, ctx) : null,
    diagnostics: a.diagnostics.map((d) => ({
      kind: d.kind,
      text: "message" in d ? d.message : diagnosticWords(d, ctx),
    })),
    assumptions: assumptionWords(a.assumptions, a.candidates, ctx),
    delay: delayCheckWords(a.delay, ctx),
  };
}

const SPOT_WARNINGS = new Set<CautionId>([
  "flammable",
  "high-pressure-co2",
  "toxic-ammonia",
  "co2-exposure",
  "oxygen-displacement",
]);
const PLACE: Partial<Record<string, CautionPlace>> = { "walk-in": "walk-in", "machine-room": "machine-room" };

/**
 * The warnings for a spot (core/domain/safety/cautions.ts): a flammable, toxic or high-pressure refrigerant
 * of its system, and oxygen displacement when the spot is in a walk-in or machine room. The practice and
 * law notices (nitrogen for pressure tests, certification, codes) are on the report's safety section; the default blend is not the system's, so it adds none.
 */
function spotCautions(c: SuspectSpotWithRefrigerant): string[] {
  const refrigerant = cautionRefrigerant(c.refrigerant);
  const place = c.reason.fixture?.distanceM === 0 ? PLACE[c.reason.fixture.kind] : undefined;
  return cautionsFor({ refrigerant, place: place ?? "sales-floor" })
    .filter((k) => SPOT_WARNINGS.has(k.id))
    .map((k) => k.text);
}
