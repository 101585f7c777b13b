import type { Paper } from "./paper";

/**
 * Everything a sweep report shows, already in words and the reader's units: the PDF builder only lays
 * it out, so the same model feeds the PDF, the e-mail's text and the tests.
 */
export interface ReportSuspect {
  rank: number;
  /** "12.1 m, 3.3 m" or "39 ft 8 in, 10 ft 10 in" */
  position: string;
  radius: string;
  /** The locator's score to two places, in the company's number format ("0.87", "0,87"). */
  score: string;
  strength: string;
  fixture: string;
  riskPoint: string;
  reason: string;
  nextCheck: string;
  /** Plan metres, for drawing the number on the map. */
  x: number;
  y: number;
  radiusM: number;
}

export interface ReportReading {
  n: number;
  time: string;
  raw: string;
  corrected: string;
  ppm: string;
  point: string;
  note: string;
}

export interface ReportFinding {
  status: string;
  found: string;
  where: string;
  note: string;
  /** Plan metres when the finding was placed on the plan: ties it to the suspect spot it answers. */
  x?: number | null;
  y?: number | null;
}

export interface SweepReportModel {
  title: string;
  /** The company's paper setting; by default US Letter under US rules, A4 under EU F-gas (./paper.ts). */
  paper: Paper;
  company: string;
  store: { name: string; address: string; timeZone: string };
  sweep: { started: string; submitted: string; status: string; technician: string; conditions: string };
  detector: { name: string; principle: string; calibration: string; settings: string };
  background: string;
  /** The delay checked against the readings, in one or two sentences (core/domain/locator-words/). */
  delayCheck: string;
  suspects: ReportSuspect[];
  /** Said instead of the list when no spot is listed: never "clean" for a plume far above the alarm. */
  noSpot: string;
  /** What the positions and strengths assume. */
  assumptions: string[];
  diagnostics: string[];
  findings: ReportFinding[];
  readings: ReportReading[];
  cautions: { text: string; source: string }[];
  /** The rendered field map (PNG) and the plan size in metres it covers. */
  map: { png: Buffer; widthM: number; heightM: number; legend: string } | null;
  generated: string;
}
