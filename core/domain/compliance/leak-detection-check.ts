import { compareDates, type IsoDate } from "../dates/calendar-date";
import { formatCalendarDay as day } from "../dates/format-in-zone";
import { nextInspectionDate, type LeakCheckInterval } from "./leak-check-interval";
import type { RuleProfile } from "./rule-profile";

/** Custom profiles saved before the field existed read as the regulation's 12 months ([S:E2,E5]). */
const DEFAULT_LDS_CHECK = {
  value: 12,
  source: "[S:E2,E5] a leak detection system is checked at least every 12 months",
};

export interface LeakDetectionCheckDue {
  dueOn: IsoDate;
  what: string;
  source: string;
}

/**
 * EU: where a leak detection system is mandatory (the system's band says so: ≥ 500 t CO2e, or HFOs
 * from 100 kg), the detection system itself is checked at least every 12 months
 * (docs/reference/standards.md §2 [S:E2,E5]). The clock runs from the latest check that found it
 * working, else from the in-service day; a check that found a fault does not restart it.
 * Null when the profile sets no leak checks or the band needs no leak detection system.
 */
export function leakDetectionCheckDue(
  profile: RuleProfile,
  interval: LeakCheckInterval | null,
  system: { inServiceOn: IsoDate; hasLeakDetection: boolean },
  checks: readonly { checkedOn: IsoDate; working: boolean }[],
): LeakDetectionCheckDue | null {
  if (!profile.leakChecks || !interval?.required || !interval.ldsRequired) return null;
  const rule = profile.leakChecks.ldsCheckMonths ?? DEFAULT_LDS_CHECK;
  const sorted = [...checks].sort((a, b) => compareDates(a.checkedOn, b.checkedOn));
  const lastWorking = sorted.filter((c) => c.working).at(-1)?.checkedOn ?? null;
  const last = sorted.at(-1) ?? null;
  const from = lastWorking ?? system.inServiceOn;
  const since = lastWorking ? `last found working ${day(lastWorking)}` : `in service since ${day(system.inServiceOn)}`;
  const fault = last && !last.working ? `; the check of ${day(last.checkedOn)} found a fault` : "";
  const none = system.hasLeakDetection ? "" : "; none is recorded on the system, and one is mandatory in its band";
  return {
    dueOn: nextInspectionDate(from, rule.value),
    what: `Check of the leak detection system (at least every ${rule.value} months; ${since}${fault}${none})`,
    source: rule.source,
  };
}
