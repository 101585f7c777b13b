import { addDays, compareDates, type IsoDate } from "../dates/calendar-date";
import { automaticLeakDetectionRequired } from "./inspections-after-breach";
import type { ApplianceType, LeakRatePart } from "./rule-profile";
import { formatCalendarDay as day } from "../dates/format-in-zone";

export interface AutomaticLeakDetection {
  required: boolean;
  /** The install deadline when required; null when the rule sets none for this in-service day. */
  dueOn: IsoDate | null;
  reason: string;
  source: string;
}

/**
 * Whether the part requires automatic leak detection on this system and by when, from the day the
 * system entered service (40 CFR 84 subpart C: CR and IPR of 1,500 lb or more [S:R4]; the install
 * dates are [M] and EPA has proposed delays [S:R4b], so they are profile data).
 */
export function automaticLeakDetection(
  part: LeakRatePart | null,
  system: { applianceType: ApplianceType; fullChargeKg: number; inServiceOn: IsoDate },
): AutomaticLeakDetection | null {
  const rule = part?.automaticLeakDetectionRequired;
  if (!part || !rule) return null;
  if (!automaticLeakDetectionRequired(part, system))
    return {
      required: false,
      dueOn: null,
      reason: "not required for this appliance type and charge",
      source: rule.source,
    };
  const d = (rule.value.installDeadlines ?? []).find(
    (x) =>
      compareDates(system.inServiceOn, x.inServiceFrom) >= 0 &&
      (!x.inServiceBefore || compareDates(system.inServiceOn, x.inServiceBefore) < 0),
  );
  const dueOn = !d ? null : d.by ? d.by : addDays(system.inServiceOn, d.withinDays ?? 0);
  const limit = rule.value.fromCharge;
  return {
    required: true,
    dueOn,
    reason: `required from ${limit.value.toLocaleString("en-US")} ${limit.unit}${dueOn ? `; install by ${day(dueOn)} (in service ${day(system.inServiceOn)})` : ""}`,
    source: rule.source,
  };
}
