import type { LocatorInput } from "../../contracts/locator-input";
import type { CorrectedReading, SuspectSpotFacts } from "../../contracts/locator-output";
import { locate, type LocatorOptions } from "../locate";
import { LOCATOR_SETTINGS } from "../locator/settings";
import { createSourceKernel } from "../locator/source-kernel";
import { driftChoiceFor } from "./drift-kernels";
import { evidenceOf, searchAroundAlarm } from "./evidence-search";
import { cutToWindow, evidenceBox, type EvidenceWindow, type PlanBox } from "./evidence-window";
import { hypothesesOf, nextProbes, type ProbeSuggestion } from "./next-probes";
import { probePlaces } from "./probe-places";

/** A live suspect spot: where, how far it may be off, and what it is at. */
export interface LiveSuspect {
  rank: number;
  x: number;
  y: number;
  radius: number;
  score: number;
  fixtureId: string | null;
  riskPointId: string | null;
}

/** The live estimate on the readings the device holds; `box` is the part of the plan it looked at. */
export type LiveEstimate =
  | { kind: "no-alarm"; readings: number }
  | { kind: "no-spot"; readings: number; box: PlanBox; lead?: LiveLead }
  | { kind: "suspects"; readings: number; box: PlanBox; suspects: LiveSuspect[] };

/**
 * Before any spot is credible: where the gas is strongest so far (the likeliest leak site around the
 * strongest alarm, evidence-search.ts), and the share of the sites' weight within 0.6 m of it. A lead
 * to probe around, not a suspect spot: the locator has not found it credible.
 */
export interface LiveLead {
  x: number;
  y: number;
  fixtureId: string | null;
  share: number;
}

/** What the next-probe step needs from the estimate, kept in the window's own coordinates. */
export interface LiveFit {
  estimate: LiveEstimate;
  window: ReturnType<typeof cutToWindow> | null;
  candidates: SuspectSpotFacts[];
  corrected: CorrectedReading[];
}

/** Suspects listed live, at most (the screen draws the top ones). */
export const LIVE_SUSPECTS = 3;

/**
 * Margin around the alarm readings, m: the kernel's truncation (the farthest a reading informs a
 * spot) plus the distance walked during one shift, since an alarm's air was drawn that far back.
 */
export function windowMarginM(input: LocatorInput, walkSpeedMps: number): number {
  const shiftS = input.instrument.transportDelayS + input.instrument.timeConstantS;
  return LOCATOR_SETTINGS.kernel.truncationM + Math.max(walkSpeedMps, 1) * shiftS;
}

/**
 * Grid cell of the live estimate, m: twice the server's 0.25 m, a quarter of the cells, so an update
 * with 300 readings keeps pace on a phone. The spot it gives stays within the radius of the full
 * analysis's on the demo sweep (tests/api/live-guide-agreement.test.ts); the radius floor is 2.5 m.
 */
export const LIVE_CELL_SIZE_M = 0.5;

/**
 * The live suspects: the same locator as the server's analysis, run on the window of the plan around
 * the alarm readings (evidence-window.ts) at LIVE_CELL_SIZE_M, its spots moved back to plan
 * coordinates. Pure and deterministic; the Walk screen runs it in a Web Worker after each committed
 * reading.
 */
export function liveFit(input: LocatorInput, options: Partial<LocatorOptions> = {}): LiveFit {
  options = { cellSize: LIVE_CELL_SIZE_M, ...options };
  const walkSpeedMps = options.walkSpeedMps ?? 1;
  const box = evidenceBox(input, windowMarginM(input, walkSpeedMps));
  if (!box)
    return {
      estimate: { kind: "no-alarm", readings: input.readings.length },
      window: null,
      candidates: [],
      corrected: [],
    };
  const window = cutToWindow(input, box);
  if (window.input.readings.length === 0)
    return { estimate: { kind: "no-spot", readings: 0, box }, window, candidates: [], corrected: [] };
  const result = locate(window.input, options);
  const suspects = result.candidates.slice(0, LIVE_SUSPECTS).map((c) => ({
    rank: c.rank,
    x: round2(c.x + box.x),
    y: round2(c.y + box.y),
    radius: c.radius,
    score: c.score,
    fixtureId: c.fixtureId,
    riskPointId: c.riskPointId,
  }));
  const n = window.input.readings.length;
  const lead = suspects.length ? null : leadOf(window, result.readings);
  return {
    estimate: suspects.length
      ? { kind: "suspects", readings: n, box, suspects }
      : lead
        ? { kind: "no-spot", readings: n, box, lead }
        : { kind: "no-spot", readings: n, box },
    window,
    candidates: result.candidates,
    corrected: result.readings,
  };
}

/** Probe places are looked for this far around the first suspect, m (a short walk along a lineup). */
export const PROBE_REACH_M = 6;

/** A probe place this close to a reading already taken counts as read, m (about a tap's jitter on the plan). */
export const TAKEN_WITHIN_M = 0.3;

/** A next probe point in plan coordinates, with the facts of why it was chosen. */
export type LiveProbe = Omit<ProbeSuggestion, "value">;

/**
 * Up to three places to probe next (core/analysis/guide/next-probes.ts) for the fit, ordered for the
 * shortest walk from `from` (where the technician stands, plan metres).
 */
export function liveProbes(fit: LiveFit, from: { x: number; y: number }, n = 3): LiveProbe[] {
  const { window, candidates } = fit;
  if (!window) return [];
  if (candidates.length === 0) return alarmProbes(fit, window, from, n);
  const { box } = window;
  const first = candidates[0];
  // A place where a reading was already taken is not offered again: the technician has its answer.
  const taken = window.input.readings;
  const places = probePlaces(window.input.plan, first, PROBE_REACH_M).filter(
    (p) => !taken.some((r) => Math.hypot(r.x - p.x, r.y - p.y) < TAKEN_WITHIN_M),
  );
  const hypotheses = hypothesesOf(candidates, fit.corrected, kernel);
  const here = { x: from.x - box.x, y: from.y - box.y };
  return toPlan(nextProbes(hypotheses, places, kernel, here, n), box);
}

/** A lead once two readings have reached the alarm (one may be a wisp; the trade re-checks it too). */
function leadOf(window: EvidenceWindow, corrected: CorrectedReading[]): LiveLead | null {
  const alarmPpm = window.input.instrument.alarmPpm;
  if (corrected.filter((r) => r.ppm >= alarmPpm && !r.flags.includes("in-benign-zone")).length < 2) return null;
  const mark = alarmSearch(window, corrected, { x: 0, y: 0 }, 0)?.mark;
  if (!mark) return null;
  const { box } = window;
  return { x: round2(mark.x + box.x), y: round2(mark.y + box.y), fixtureId: mark.fixtureId, share: round2(mark.share) };
}

/**
 * While no spot is credible: where the strongest alarm's gas came from (evidence-search.ts), probing
 * between where its air was drawn in and where it was read, to bracket the peak along the case.
 */
function alarmProbes(fit: LiveFit, window: EvidenceWindow, from: { x: number; y: number }, n: number): LiveProbe[] {
  const { box } = window;
  const search = alarmSearch(window, fit.corrected, { x: from.x - box.x, y: from.y - box.y }, n);
  return search ? toPlan(search.probes, box) : [];
}

/** searchAroundAlarm on the window, about its strongest alarm (window coordinates). */
function alarmSearch(window: EvidenceWindow, corrected: CorrectedReading[], from: { x: number; y: number }, n: number) {
  const alarm = strongestAlarm(corrected, window.input.instrument.alarmPpm);
  if (!alarm) return null;
  return searchAroundAlarm({
    plan: window.input.plan,
    origin: alarm.corrected,
    alarm: alarm.raw,
    evidence: evidenceOf(corrected, window.input.instrument),
    read: window.input.readings,
    from,
    kernel,
    n,
    drift: driftChoiceFor(window.input.plan),
    upwind: true,
  });
}

/** The strongest reading at or above the alarm outside benign zones (the latest of equals), as the window anchors on. */
function strongestAlarm(readings: readonly CorrectedReading[], alarmPpm: number): CorrectedReading | null {
  let best: CorrectedReading | null = null;
  for (const r of readings) {
    if (r.ppm < alarmPpm || r.flags.includes("in-benign-zone")) continue;
    if (!best || r.ppm >= best.ppm) best = r;
  }
  return best;
}

const toPlan = (probes: ProbeSuggestion[], box: PlanBox): LiveProbe[] =>
  probes.map(({ value: _value, ...p }) => ({ ...p, x: round2(p.x + box.x), y: round2(p.y + box.y) }));

const sourceKernel = createSourceKernel(
  LOCATOR_SETTINGS.kernel.screeningLengthM,
  LOCATOR_SETTINGS.kernel.nearCutoffM,
  LOCATOR_SETTINGS.kernel.truncationM,
);
const kernel = (d: number) => sourceKernel.at(d);

const round2 = (v: number) => Math.round(v * 100) / 100;
