import type { LiveLead, LiveProbe, LiveSuspect } from "../../analysis/guide/live-guide";
import { lengthWords } from "./length-words";
import type { WordsContext } from "./words-context";

/** The label every live mark carries: the server's analysis after submit stays the reference. */
export const LIVE_PROVISIONAL_WORDS = "Live estimate on this device — the full analysis after submit is the reference.";

/** "Dairy 3", or "suspect 2" when the spot is on no named fixture. */
function spotName(rank: number, fixtureId: string | null, ctx: WordsContext): string {
  return (fixtureId && ctx.name(fixtureId)) || `suspect ${rank}`;
}

/** "Suspect 1: Dairy 3, within 2.5 m" */
export function liveSuspectWords(s: LiveSuspect, ctx: WordsContext): string {
  const where = (s.fixtureId && ctx.name(s.fixtureId)) || "open floor";
  return `Suspect ${s.rank}: ${where}, within ${lengthWords(s.radius, ctx.length, ctx.numbers)}`;
}

/** Before any credible spot: where the gas is strongest so far, said to be provisional. */
export function liveLeadWords(lead: LiveLead, ctx: WordsContext): string {
  const name = lead.fixtureId && ctx.name(lead.fixtureId);
  return `No credible spot yet: the gas is strongest so far ${name ? `at ${name}` : "here"}`;
}

/** Where the probe goes, as the technician finds it on the floor. */
export function probePlaceWords(p: LiveProbe, ctx: WordsContext): string {
  const name = p.fixtureId ? ctx.name(p.fixtureId) : null;
  switch (p.kind) {
    case "case-front":
      return name ? `${name}, at the front grille` : "the case front, at the grille";
    case "room-low":
      return `${name ?? "the room"}, low by the floor`;
    case "room-high":
      return `${name ?? "the room"}, high by the ceiling`;
    case "line-set":
      return name ? `line-set drop ${name}` : "the line-set drop";
  }
}

/** Why a reading there helps, in the member's words: "tells Dairy 3 from Dairy 4". */
export function probeReasonWords(p: LiveProbe, ctx: WordsContext): string {
  const r = p.reason;
  if (r.kind === "separates") {
    const a = spotName(r.ranks[0], r.fixtureIds[0], ctx);
    const b = spotName(r.ranks[1], r.fixtureIds[1], ctx);
    return a === b ? `tells two spots on ${a} apart` : `tells ${a} from ${b}`;
  }
  if (r.kind === "traces") {
    const where = (r.fixtureId && ctx.name(r.fixtureId)) || "the cases here";
    return `finds where along ${where} the alarm's gas is strongest`;
  }
  return `narrows down where on ${spotName(r.rank, r.fixtureId, ctx)} the leak is`;
}

/**
 * The check the trade makes to confirm a leak in a case once the spot has settled: read the air the
 * case's fans blow off its coil, at the discharge (supply-air) grille, against the aisle's reading; the
 * coil and its joints sit in that air stream (common practice, no published source).
 */
export function supplyAirAskWords(s: LiveSuspect, settledOver: number, ctx: WordsContext): string {
  const where = (s.fixtureId && ctx.name(s.fixtureId)) || "this spot";
  return `Suspect 1 has stayed on ${where} over the last ${settledOver} estimates. Confirm it: read the supply air at ${where}'s discharge grille, where the air leaves the coil. Higher than the aisle there points to a leak in this case.`;
}

/** The note kept with the supply-air reading, naming the suspect it checks. */
export function supplyAirNote(s: LiveSuspect, ctx: WordsContext): string {
  const where = (s.fixtureId && ctx.name(s.fixtureId)) || "open floor";
  return `Supply-air check of live suspect 1 (${where}, ${lengthWords(s.x, ctx.length, ctx.numbers)} across, ${lengthWords(s.y, ctx.length, ctx.numbers)} down)`;
}
