import { z } from "zod";
import { text } from "./text";
import { SECONDS_STEP } from "./quantities";
import type { Candidate, Diagnostic, CorrectedReading } from "./locator-output";

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

/** A suspect spot: the locator's `Candidate` (locator-output.ts; the checks at the end keep the two equal). */
export const suspectSpot = z.object({
  rank: z.number(),
  x: z.number(),
  y: z.number(),
  radius: z.number(),
  score: z.number(),
  strength: z.number(),
  strengthGPerYear: z.number(),
  fixtureId: text().nullable(),
  riskPointId: text().nullable(),
  reason: text(),
  nextCheck: text(),
});
export type SuspectSpot = z.infer<typeof suspectSpot>;

const LOCATOR_DIAGNOSTIC_KINDS = [
  "fans-mixing",
  "benign-source",
  "sparse-coverage",
  "one-sided-pass",
  "early-readings",
  "over-range",
  "delay-check",
  "delay-uncertain",
] as const;
/** API-added diagnostics beside the locator's own kinds. */
const API_DIAGNOSTIC_KINDS = ["detector-overdue", "detector-settings", "delay-changed"] as const;

export const analysisDiagnostic = z.object({
  kind: z.enum([...LOCATOR_DIAGNOSTIC_KINDS, ...API_DIAGNOSTIC_KINDS]),
  message: text(),
  fixtureId: text().optional(),
  zoneId: text().optional(),
});
export type AnalysisDiagnostic = z.infer<typeof analysisDiagnostic>;
export type AnalysisDiagnosticKind = AnalysisDiagnostic["kind"];

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
  assumptions: z.array(text()),
  readings: z.array(analysisReading),
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
const sameSpot: Same<Candidate, SuspectSpot> = true;
const sameKinds: Same<Diagnostic["kind"], (typeof LOCATOR_DIAGNOSTIC_KINDS)[number]> = true;
const sameReading: Same<Omit<CorrectedReading, "flags">, Omit<AnalysisReading, "readingId" | "flags">> = true;
const sameFlags: Same<CorrectedReading["flags"][number], AnalysisReading["flags"][number]> = true;
void [sameSpot, sameKinds, sameReading, sameFlags];
