import { z } from "zod";
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

export interface AnalysisParams {
  transportDelayS: number;
  timeConstantS: number;
  alarmPpm: number;
  cellSize: number;
}

/** API-added diagnostics beside the locator's own kinds. */
export type AnalysisDiagnosticKind = Diagnostic["kind"] | "detector-overdue" | "detector-settings" | "delay-changed";

export interface AnalysisDiagnostic {
  kind: AnalysisDiagnosticKind;
  message: string;
  fixtureId?: string;
  zoneId?: string;
}

export interface AnalysisReading extends CorrectedReading {
  /** The stored reading's id (readings are analysed in time order). */
  readingId: string;
}

/** Everything except the grid: stored as JSON in analyses.result. */
export interface AnalysisSummary {
  candidates: Candidate[];
  background: { ppm: number };
  diagnostics: AnalysisDiagnostic[];
  assumptions: string[];
  readings: AnalysisReading[];
}

export interface EncodedField {
  width: number;
  height: number;
  cellSize: number;
  /** base64 of Float32 little-endian ppm per cell, row-major; NaN where unknown. */
  values: string;
  /** base64 of one byte per cell: confidence × 255. */
  confidence: string;
}

export interface AnalysisResponse extends AnalysisSummary {
  sweepId: string;
  params: AnalysisParams;
  /** Revision of the readings this result was computed from … */
  readingsRevision: number;
  /** … and the sweep's revision now. */
  currentReadingsRevision: number;
  /** Readings changed since: the result is shown but must be recomputed. */
  stale: boolean;
  /** A recompute is running (ask again to get it). */
  recomputing: boolean;
  computedAt: string;
  durationMs: number;
  field: EncodedField;
}
