import type { LocatorFixtureKind, LocatorRiskPointKind } from "./locator-input";

// The locator's output. `LocatorResult` is what locate() returns: structured facts (ids, metres, ppm, seconds,
// kinds), no sentences; core/domain/locator-words/ writes the words with the reader's units and names.
// `LocatorOutput` is the command-line contract of docs/locator/command-line.md (short names fixed there),
// made from a result by commandLineOutput() in that module.

/** What to check next at a suspect spot, in the order to do it. */
export type SpotNextCheck =
  | { kind: "risk-point-first"; riskPointId: string; riskPointKind: LocatorRiskPointKind; distanceM: number }
  /** The fixture's fans mix the gas: stop them (or wait for defrost), then re-check on a grid. */
  | { kind: "stop-fans"; fixtureId: string; spacingM: number; withinM: number }
  | { kind: "grid-recheck"; spacingM: number; withinM: number }
  /** The spot was seen from one pass: walk the other face. */
  | { kind: "other-face" };

/** Why a spot is listed. */
export interface SpotReason {
  /**
   * "fitted": one source here explains the readings best; "alternative": fits almost as well as a
   * higher-ranked spot; "one-reading": one reading far above the alarm that nothing else nearby rises
   * with, so no source could be fitted (re-check around it).
   */
  kind: "fitted" | "alternative" | "one-reading";
  /** Readings near the spot raised over the background, their peak and the background, ppm. */
  supportCount: number;
  peakPpm: number;
  backgroundPpm: number;
  /** The fixture the spot lies in (distance 0) or nearest to, m; null in open floor. */
  fixture: { id: string; kind: LocatorFixtureKind; distanceM: number } | null;
  /** Seen from one pass only, so the side of the path is uncertain. */
  oneSided: boolean;
}

/** A suspect spot as facts. */
export interface SuspectSpotFacts {
  rank: number;
  x: number;
  y: number;
  /** Search radius in metres, calibrated on the scenario benchmark, not a raw misfit contour. */
  radius: number;
  /** 0..1, for ordering and display only. */
  score: number;
  /** Relative to the first spot (1.0). */
  strength: number;
  /**
   * Emission under the well-mixed assumption, mol/yr: ppm is a mole fraction, so the room balance gives
   * moles; times the refrigerant's molar mass it is a mass (the presenter picks the refrigerant).
   */
  molPerYear: number;
  fixtureId: string | null;
  riskPointId: string | null;
  reason: SpotReason;
  nextChecks: SpotNextCheck[];
}

/** What the technician should know about the sweep, as facts. */
export type LocatorDiagnostic =
  /** Readings level and above the alarm all over a fixture whose fans run. */
  | {
      kind: "fans-mixing";
      fixtureId: string;
      count: number;
      levelPpm: number;
      /** A pinpoint pass stilled the fixture afterwards: its readings placed the spots (decision 0111). */
      stilledByPass?: boolean;
    }
  /** Readings near a background zone explained by it. */
  | { kind: "benign-source"; zoneId: string; note: string | null; count: number; peakPpm: number }
  /** Taps farther apart than gapM somewhere; the longest gap and its middle, m. */
  | { kind: "sparse-coverage"; count: number; gapM: number; longestM: number; at: { x: number; y: number } }
  | { kind: "one-sided-pass" }
  /** Readings taken before one shift (delay plus time constant, s) had passed. */
  | { kind: "early-readings"; count: number; shiftS: number }
  | { kind: "over-range"; count: number }
  /** The readings fit another shift clearly better; `used` when the spots are placed with it. */
  | { kind: "delay-check"; statedS: number; estimatedS: number; used: boolean }
  /**
   * A plume far above the alarm fitted no spot with the stated shift: `usedS` is the shift the spots were
   * placed with after a retry, or null when nothing fitted at all (the sweep is still not clean).
   */
  | { kind: "delay-uncertain"; plumePpm: number; alarmPpm: number; statedS: number; usedS: number | null };

export type DiagnosticKind = LocatorDiagnostic["kind"];

/** The assumptions behind the positions and the strengths, as facts. */
export interface LocatorAssumptions {
  /** Readings moved back along the walk by this shift, s. */
  shiftS: number;
  /** The well-mixed room behind the strength per year. */
  mixingHeightM: number;
  airChangesPerH: number;
  /** Molar volume, L/mol, and the conditions it holds at. */
  molarVolumeL: number;
  temperatureC: number;
  pressureKPa: number;
}

/** A suspect spot in the command-line contract (docs/locator/command-line.md). */
export interface Candidate {
  rank: number;
  x: number;
  y: number;
  radius: number;
  score: number;
  strength: number;
  /** Emission estimate under the stated well-mixed assumption (see `assumptions`). */
  strengthGPerYear: number;
  fixtureId: string | null;
  riskPointId: string | null;
  reason: string;
  nextCheck: string;
}

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

export interface LocatorResult {
  candidates: SuspectSpotFacts[];
  background: { ppm: number };
  diagnostics: LocatorDiagnostic[];
  assumptions: LocatorAssumptions;
  readings: CorrectedReading[];
  field: FieldGrid;
  delay: DelayFacts;
}
