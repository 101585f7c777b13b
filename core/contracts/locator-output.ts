// The locator's output. `LocatorOutput` is the command-line contract of docs/locator/command-line.md (short names fixed
// there); `LocatorResult` adds what the field map and the Walk screen draw.

export interface Candidate {
  rank: number;
  x: number;
  y: number;
  /** Search radius in metres, calibrated on the scenario benchmark, not a raw misfit contour. */
  radius: number;
  /** 0..1, for ordering and display only. */
  score: number;
  /** Relative to the first candidate (1.0). */
  strength: number;
  /** Emission estimate under the stated well-mixed assumption (see `assumptions`). */
  strengthGPerYear: number;
  fixtureId: string | null;
  riskPointId: string | null;
  reason: string;
  nextCheck: string;
}

export type DiagnosticKind =
  | "fans-mixing"
  | "benign-source"
  | "sparse-coverage"
  | "one-sided-pass"
  | "early-readings"
  | "over-range"
  | "delay-check"
  | "delay-uncertain";

export interface Diagnostic {
  kind: DiagnosticKind;
  message: string;
  fixtureId?: string;
  zoneId?: string;
}

export interface LocatorOutput {
  candidates: Candidate[];
  background: { ppm: number };
  diagnostics: Diagnostic[];
  assumptions: string[];
}

export type ReadingFlag = "before-delay" | "path-gap" | "snapped" | "over-range" | "in-benign-zone";

export interface CorrectedReading {
  index: number;
  raw: { x: number; y: number };
  corrected: { x: number; y: number };
  t: number;
  ppm: number;
  flags: ReadingFlag[];
}

export interface FieldGrid {
  width: number;
  height: number;
  cellSize: number;
  /** ppm, row-major values[y * width + x]; NaN where nobody sampled (unknown, never invented). */
  values: Float32Array;
  /** 0..1 sampling confidence per cell. */
  confidence: Float32Array;
}

/**
 * The detector's delay checked against the readings (core/analysis/lag/delay-check.ts). Shifts are the
 * transport delay plus the time constant, in seconds.
 */
export interface DelayFacts {
  /** The shift the detector states. */
  statedS: number;
  /** The shift the readings fit best; null when no two visits overlap, so nothing can be checked. */
  estimatedS: number | null;
  /** The readings clearly fit the estimate better than the stated shift. */
  supported: boolean;
  /** The shift the suspect spots were placed with. */
  usedS: number;
  /** Misfit of the readings (mean squared log difference between visits) at the stated and estimated shift. */
  statedMisfit: number | null;
  estimatedMisfit: number | null;
}

export interface LocatorResult extends LocatorOutput {
  readings: CorrectedReading[];
  field: FieldGrid;
  delay: DelayFacts;
}
