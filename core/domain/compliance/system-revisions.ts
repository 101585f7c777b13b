import { compareDates, type IsoDate } from "../dates/calendar-date";
import type { Refrigerant } from "../refrigerants/types";
import type { ApplianceType } from "./rule-profile";

/** The facts of a system that rules read, as they stood on some day. */
export interface SystemFacts {
  refrigerant: Refrigerant;
  fullChargeKg: number;
  applianceType: ApplianceType;
  automaticLeakDetection: boolean;
  inServiceOn: IsoDate;
}

export type RevisionKind = "first" | "change" | "correction" | "retrofit";

/** Facts in force from `effectiveFrom` (store calendar) until the next revision. */
export interface SystemRevision extends SystemFacts {
  effectiveFrom: IsoDate;
  kind: RevisionKind;
}

/** A stretch of a system's life under one refrigerant fill: a retrofit revision starts the next. */
export interface Regime {
  /** First day (inclusive); null for the system's first regime, which reaches back to any earlier record. */
  from: IsoDate | null;
  /** First day of the next regime (exclusive), or null. */
  until: IsoDate | null;
}

const ordered = (revisions: readonly SystemRevision[]) =>
  [...revisions].sort((a, b) => compareDates(a.effectiveFrom, b.effectiveFrom));

/**
 * The facts in force on a date: the latest revision effective on or before it. A record dated
 * before the first revision (history typed in later) reads the first revision's values.
 */
export function factsOn(revisions: readonly SystemRevision[], date: IsoDate): SystemFacts {
  const list = ordered(revisions);
  if (list.length === 0) throw new Error("a system has at least one revision");
  let inForce = list[0];
  for (const r of list) if (compareDates(r.effectiveFrom, date) <= 0) inForce = r;
  return inForce;
}

/**
 * The system's regimes: a retrofit revision (a new refrigerant) starts a new one, and no leak-rate
 * figure, breach or chronic-leaker year reaches across it (docs/decisions/0043-system-revisions.md).
 */
export function regimesOf(revisions: readonly SystemRevision[]): Regime[] {
  const starts = ordered(revisions)
    .filter((r) => r.kind === "retrofit")
    .map((r) => r.effectiveFrom);
  const bounds: (IsoDate | null)[] = [null, ...starts];
  return bounds.map((from, i) => ({ from, until: bounds[i + 1] ?? null }));
}

export function inRegime(regime: Regime, date: IsoDate): boolean {
  return (
    (regime.from === null || compareDates(date, regime.from) >= 0) &&
    (regime.until === null || compareDates(date, regime.until) < 0)
  );
}
