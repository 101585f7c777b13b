import { addMonths, compareDates, type IsoDate } from "../dates/calendar-date";
import type { RuleProfile } from "./rule-profile";

export interface Retention {
  years: number;
  source: string;
  /** For a retired system: the day its records may first be discarded; null while it is in service. */
  keptUntil: IsoDate | null;
}

/**
 * How long a system's records are kept, from the rule profile (US 3 years [S:R6,R7]; EU at least
 * 5 years [S:E8b]). No record is dated after the retirement but the closing of a finding because the
 * system left service (docs/decisions/0166), so counting the years from the later of the retirement
 * day and the latest record keeps every record at least that long after its own date.
 */
export function recordRetention(
  profile: RuleProfile,
  retiredOn: IsoDate | null,
  latestRecordOn: IsoDate | null = null,
): Retention {
  const years = profile.recordRetentionYears.value;
  const from = retiredOn && latestRecordOn && compareDates(latestRecordOn, retiredOn) > 0 ? latestRecordOn : retiredOn;
  return {
    years,
    source: profile.recordRetentionYears.source,
    keptUntil: from ? addMonths(from, years * 12) : null,
  };
}
