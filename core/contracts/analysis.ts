import { z } from "zod";
import { text } from "./text";
import { SECONDS_STEP } from "./quantities";
import { locatorFixtureKinds, locatorRiskPointKinds } from "./locator-input";
import type {
  CorrectedReading,
  DelayFacts,
  LocatorAssumptions,
  LocatorDiagnostic,
  SuspectSpotFacts,
} from "./locator-output";
import type { SpotRefrigerant } from "../domain/locator-words/spot-refrigerant";

// The field map's analysis: GET /api/sweeps/:id/analysis. Candidates are suspect spots.

const tenths = (v: number) => Number((Math.round(v / SECONDS_STEP) * SECONDS_STEP).toFixed(1));

export const analysisQuery = z.object({
  transportDelayS: z.coerce
    .number("must be a number of seconds")
    .finite("must be a finite number of seconds")
    .min(0, "must be 0 s or more")
    .max(60, "must be at most 60 s (a longer sample line than any hand detector has)")
    // Tenths of a second: each distinct value is a new analysis job and a stored row.
    .transform(tenths)
    .optional(),
  timeConstantS: z.coerce
    .number("must be a number of seconds")
    .finite("must be a finite number of seconds")
    .min(0, "must be 0 s or more")
    .max(30, "must be at most 30 s")
    .transform(tenths)
    .optional(),
  /** "true": wait for a stale result's recompute instead of answering with the stale one. */
  wait: z.enum(["true", "false"], "must be true or false").optional(),
});
export type AnalysisQuery = z.infer<typeof analysisQuery>;

const point = z.object({ x: z.number(), y: z.number() });

export const analysisParams = z.object({
  transportDelayS: z.number(),
  timeConstantS: z.number(),
  alarmPpm: z.number(),
  cellSize: z.number(),
});
export type AnalysisParams = z.infer<typeof analysisParams>;

const fixtureKind = z.enum(locatorFixtureKinds);
const riskPointKind = z.enum(locatorRiskPointKinds);

/** Why a spot is listed (the locator's `SpotReason`, worded by core/domain/locator-words/). */
const spotReason = z.object({
  kind: z.enum(["fitted", "alternative", "one-reading"]),
  supportCount: z.number(),
  peakPpm: z.number(),
  backgroundPpm: z.number(),
  fixture: z.object({ id: text(), kind: fixtureKind, distanceM: z.number() }).nullable(),
  oneSided: z.boolean(),
});

const spotNextCheck = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("risk-point-first"), riskPointId: text(), riskPointKind, distanceM: z.number() }),
  z.object({ kind: z.literal("stop-fans"), fixtureId: text(), spacingM: z.number(), withinM: z.number() }),
  z.object({ kind: z.literal("grid-recheck"), spacingM: z.number(), withinM: z.number() }),
  z.object({ kind: z.literal("other-face") }),
]);

/** A suspect spot as the locator's facts (`SuspectSpotFacts`; the checks at the end keep the two equal). */
export const suspectSpot = z.object({
  rank: z.number(),
  x: z.number(),
  y: z.number(),
  radius: z.number(),
  score: z.number(),
  strength: z.number(),
  molPerYear: z.number(),
  fixtureId: text().nullable(),
  riskPointId: text().nullable(),
  reason: spotReason,
  nextChecks: z.array(spotNextCheck),
});
export type SuspectSpot = z.infer<typeof suspectSpot>;

/** The refrigerant a spot's strength is weighed in, looked up when the analysis is read (fixtures may be relinked). */
/** A refrigerant the company entered, carried with the spot so every reader can word it and give its cautions. */
const enteredRefrigerant = z.object({
  name: text(),
  safetyClass: text(),
  components: z.array(z.object({ id: text(), massPercent: z.number() })).nullable(),
  molarMass: z.number().nullable(),
});

export const spotRefrigerantSchema = z.discriminatedUnion("source", [
  z.object({
    source: z.literal("system"),
    refrigerantId: text(),
    molarMassGPerMol: z.number(),
    systemName: text(),
    /** Set for a company's own refrigerant (docs/decisions/0073). */
    entered: enteredRefrigerant.optional(),
    /** Set when its molar mass is not known: the default blend's whose molar mass was used instead. */
    molarMassAssumedFrom: text().optional(),
  }),
  z.object({
    source: z.literal("default"),
    refrigerantId: text(),
    molarMassGPerMol: z.number(),
    why: z.enum(["no-fixture", "no-system", "unknown-refrigerant", "no-systems-known"]),
  }),
]);

export const suspectSpotWithRefrigerant = suspectSpot.extend({ refrigerant: spotRefrigerantSchema });
export type SuspectSpotWithRefrigerant = z.infer<typeof suspectSpotWithRefrigerant>;

const locatorDiagnostic = [
  z.object({
    kind: z.literal("fans-mixing"),
    fixtureId: text(),
    count: z.number(),
    levelPpm: z.number(),
    stilledByPass: z.boolean().optional(),
  }),
  z.object({
    kind: z.literal("benign-source"),
    zoneId: text(),
    note: text().nullable(),
    count: z.number(),
    peakPpm: z.number(),
  }),
  z.object({
    kind: z.literal("sparse-coverage"),
    count: z.number(),
    gapM: z.number(),
    longestM: z.number(),
    at: z.object({ x: z.number(), y: z.number() }),
  }),
  z.object({ kind: z.literal("one-sided-pass") }),
  z.object({ kind: z.literal("early-readings"), count: z.number(), shiftS: z.number() }),
  z.object({ kind: z.literal("over-range"), count: z.number() }),
  z.object({ kind: z.literal("delay-check"), statedS: z.number(), estimatedS: z.number(), used: z.boolean() }),
  z.object({
    kind: z.literal("delay-uncertain"),
    plumePpm: z.number(),
    alarmPpm: z.number(),
    statedS: z.number(),
    usedS: z.number().nullable(),
  }),
] as const;
/** API-added diagnostics beside the locator's own kinds: about the detector, already in words (no lengths, no ids). */
const API_DIAGNOSTIC_KINDS = ["detector-overdue", "detector-settings", "delay-changed"] as const;

export const analysisDiagnostic = z.discriminatedUnion("kind", [
  ...locatorDiagnostic,
  z.object({ kind: z.enum(API_DIAGNOSTIC_KINDS), message: text() }),
]);
export type AnalysisDiagnostic = z.infer<typeof analysisDiagnostic>;
export type AnalysisDiagnosticKind = AnalysisDiagnostic["kind"];
export type DetectorDiagnostic = Extract<AnalysisDiagnostic, { message: string }>;

const locatorAssumptions = z.object({
  shiftS: z.number(),
  mixingHeightM: z.number(),
  airChangesPerH: z.number(),
  molarVolumeL: z.number(),
  temperatureC: z.number(),
  pressureKPa: z.number(),
});

/** The delay checked against the readings (`DelayFacts`). */
export const delayFacts = z.object({
  statedS: z.number(),
  estimatedS: z.number().nullable(),
  supported: z.boolean(),
  usedS: z.number(),
  statedMisfit: z.number().nullable(),
  estimatedMisfit: z.number().nullable(),
});

const READING_FLAGS = ["before-delay", "path-gap", "snapped", "over-range", "in-benign-zone"] as const;

export const analysisReading = z.object({
  index: z.number(),
  /** The stored reading's id (readings are analysed in time order). */
  readingId: text(),
  raw: point,
  corrected: point,
  t: z.number(),
  ppm: z.number(),
  flags: z.array(z.enum(READING_FLAGS)),
});
export type AnalysisReading = z.infer<typeof analysisReading>;

/** Everything except the grid: stored as JSON in analyses.result. */
export const analysisSummary = z.object({
  candidates: z.array(suspectSpot),
  background: z.object({ ppm: z.number() }),
  diagnostics: z.array(analysisDiagnostic),
  assumptions: locatorAssumptions,
  readings: z.array(analysisReading),
  delay: delayFacts,
});
export type AnalysisSummary = z.infer<typeof analysisSummary>;

export const encodedField = z.object({
  width: z.number(),
  height: z.number(),
  cellSize: z.number(),
  /** base64 of Float32 little-endian ppm per cell, row-major; NaN where unknown. */
  values: text(),
  /** base64 of one byte per cell: confidence × 255. */
  confidence: text(),
});
export type EncodedField = z.infer<typeof encodedField>;

/** The answer of GET /api/sweeps/:id/analysis; the client parses it with this same schema. */
export const analysisResponse = analysisSummary.extend({
  candidates: z.array(suspectSpotWithRefrigerant),
  sweepId: text(),
  params: analysisParams,
  /** Revision of the readings this result was computed from … */
  readingsRevision: z.number(),
  /** … and the sweep's revision now. */
  currentReadingsRevision: z.number(),
  /** Readings changed since: the result is shown but must be recomputed. */
  stale: z.boolean(),
  /** A recompute is running (ask again to get it). */
  recomputing: z.boolean(),
  computedAt: text(),
  durationMs: z.number(),
  field: encodedField,
});
export type AnalysisResponse = z.infer<typeof analysisResponse>;

// The locator's own types and these schemas must describe the same values: a change to one side
// that the other does not follow fails the typecheck here.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const sameSpot: Same<SuspectSpotFacts, SuspectSpot> = true;
const sameDiagnostics: Same<LocatorDiagnostic, Exclude<AnalysisDiagnostic, DetectorDiagnostic>> = true;
const sameAssumptions: Same<LocatorAssumptions, z.infer<typeof locatorAssumptions>> = true;
const sameDelay: Same<DelayFacts, z.infer<typeof delayFacts>> = true;
const sameReading: Same<Omit<CorrectedReading, "flags">, Omit<AnalysisReading, "readingId" | "flags">> = true;
const sameFlags: Same<CorrectedReading["flags"][number], AnalysisReading["flags"][number]> = true;
const sameRefrigerant: Same<SpotRefrigerant, z.infer<typeof spotRefrigerantSchema>> = true;
void [sameSpot, sameDiagnostics, sameAssumptions, sameDelay, sameReading, sameFlags, sameRefrigerant];
