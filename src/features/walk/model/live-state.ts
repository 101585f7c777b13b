import type { LiveEstimate, LiveProbe, LiveSuspect } from "#core/analysis/guide/live-guide";
import type { LiveReply } from "./live-messages";

/**
 * The first suspect has settled when it stayed within its radius over this many live estimates in a
 * row (each after a new reading): then the screen asks for the supply-air check. Three, as the
 * guidance benchmark's stopping rule (scripts/bench/guide/guided.ts), with the radius instead of a
 * fixed 0.3 m because a live spot is only as sure as its radius.
 */
export const SETTLE_ESTIMATES = 3;

export interface LiveState {
  /** The id of the last request sent; answers to older ones are stale. */
  sent: number;
  estimate: LiveEstimate | null;
  probes: LiveProbe[];
  /** The first suspect of each of the latest estimates, newest last. */
  firsts: LiveSuspect[];
  /** What the worker said was wrong with the last request, if anything. */
  problems: string[];
  /** Estimates taken in so far (stale ones not counted). */
  answered: number;
  /** Milliseconds the worker took for the last estimate and probes. */
  ms: { estimate: number; probes: number };
}

export const LIVE_START: LiveState = {
  sent: -1,
  estimate: null,
  probes: [],
  firsts: [],
  problems: [],
  answered: 0,
  ms: { estimate: 0, probes: 0 },
};

export function liveRequested(s: LiveState, id: number): LiveState {
  return { ...s, sent: id };
}

/** One answer from the worker; a stale one (an older request than the last sent) changes nothing. */
export function liveReplied(s: LiveState, reply: LiveReply): LiveState {
  if (reply.id < s.sent) return s;
  switch (reply.kind) {
    case "failed":
      return { ...s, problems: reply.problems };
    case "probes":
      return { ...s, probes: reply.probes, ms: { ...s.ms, probes: reply.ms } };
    case "estimate": {
      const first = reply.estimate.kind === "suspects" ? reply.estimate.suspects[0] : null;
      return {
        ...s,
        estimate: reply.estimate,
        // the next probes of the previous estimate no longer apply
        probes: [],
        firsts: first ? [...s.firsts, first].slice(-SETTLE_ESTIMATES) : [],
        problems: [],
        answered: s.answered + 1,
        ms: { estimate: reply.ms, probes: 0 },
      };
    }
  }
}

/** The settled first suspect (see SETTLE_ESTIMATES), or null while it still moves. */
export function settledSuspect(s: LiveState): LiveSuspect | null {
  if (s.firsts.length < SETTLE_ESTIMATES) return null;
  const last = s.firsts[s.firsts.length - 1];
  return s.firsts.every((f) => Math.hypot(f.x - last.x, f.y - last.y) <= last.radius) ? last : null;
}
