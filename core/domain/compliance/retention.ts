import { addMonths, type IsoDate } from "../dates/calendar-date";
import type { RuleProfile } from "./rule-profile";

export interface Retention {
  years: number;
  source: string;
  /** For a retired system: the day its records may first be discarded; null while it is in service. */
  keptUntil: IsoDate | null;
}

/**
 * How long a system's records are kept, from the rule profile (US 3 years [S:R6,R7]; EU at least
 * 5 years [S:E8b]). No record is dated after the retirement, so counting the years from the
 * retirement day keeps every record at least that long after its own date.
 */
export function recordRetention(profile: RuleProfile, retiredOn: IsoDate | null): Retention {
  const years = profile.recordRetentionYears.value;
  return {
    years,
    source: profile.recordRetentionYears.source,
    keptUntil: retiredOn ? addMonths(retiredOn, years * 12) : null,
  };
}
