import { compareDates } from "../dates/calendar-date";
import { formatCalendarDay as day } from "../dates/format-in-zone";
import type { FindingAction, FindingEventKind, FindingStatus } from "./lifecycle";

/**
 * The day rule of a finding whose system has left service (docs/decisions/0166): no step is dated
 * after the retirement day (no record may be, docs/decisions/0124), except the closing that says the
 * system left service, which is dated on or after it. Returns the field error for `on`, or null.
 */
export function leftServiceDayError(
  action: FindingAction,
  on: string,
  system: { name: string; retiredOn: string | null },
): string | null {
  const { retiredOn, name } = system;
  if (action === "close-left-service") {
    if (retiredOn === null) return null; // the lifecycle refuses it with the reason
    return compareDates(on, retiredOn) < 0
      ? `must not be before ${day(retiredOn)}, the day ${name} left service`
      : null;
  }
  if (retiredOn === null || compareDates(on, retiredOn) <= 0) return null;
  const limit = `must not be after ${day(retiredOn)}, the day ${name} left service`;
  // A verified repair closes as verified, dated by then; the closing as left service is not offered for it.
  if (action === "close") return `${limit}: date the closing of the verified repair by then`;
  return `${limit}: record a step taken by then, or close the finding because the system left service`;
}

/**
 * A finding's state in words, as the records page, the finding screen and the statement write it:
 * the status, and for a finding closed because its system left service, that reason.
 */
export function findingStateWords(finding: {
  status: FindingStatus;
  events: readonly { kind: FindingEventKind }[];
  systemRetiredOn?: string | null;
}): string {
  if (finding.status === "closed" && finding.events.at(-1)?.kind === "closed-left-service")
    return finding.systemRetiredOn
      ? `closed: the system left service on ${day(finding.systemRetiredOn)}`
      : "closed: the system left service";
  const open = finding.status !== "closed" && finding.status !== "dismissed";
  if (open && finding.systemRetiredOn)
    return `${finding.status}; the system left service on ${day(finding.systemRetiredOn)}: to be closed`;
  return finding.status;
}
