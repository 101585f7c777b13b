import type { z } from "zod";
import { APPLIANCE_TYPE_NAMES, type systemRevision } from "../../contracts/systems";
import { formatCalendarDay } from "../dates/format-in-zone";

/** One revision as the API lists it (GET /api/systems/:id/revisions). */
export type RevisionRow = z.infer<typeof systemRevision>;

type Facts = Pick<
  RevisionRow,
  "refrigerantName" | "fullChargeKg" | "applianceType" | "automaticLeakDetection" | "inServiceOn"
>;

const ald = (on: boolean) => (on ? "yes" : "no");

/**
 * What a revision set, in words an auditor reads beside the figures that use it: the first revision
 * lists every fact; each later one names the facts it changed from the values in force before it
 * (docs/decisions/0043-system-revisions.md, docs/decisions/0126-system-history-on-the-statement.md).
 * `mass` writes a full charge the way the statement writes masses.
 */
export function revisionChanges(previous: Facts | null, next: Facts, mass: (kg: number) => string): string {
  if (!previous)
    return [
      `refrigerant ${next.refrigerantName}`,
      `full charge ${mass(next.fullChargeKg)}`,
      APPLIANCE_TYPE_NAMES[next.applianceType].toLowerCase(),
      `automatic leak detection: ${ald(next.automaticLeakDetection)}`,
      `in service since ${formatCalendarDay(next.inServiceOn)}`,
    ].join("; ");
  const changed: string[] = [];
  if (previous.refrigerantName !== next.refrigerantName)
    changed.push(`refrigerant from ${previous.refrigerantName} to ${next.refrigerantName}`);
  if (previous.fullChargeKg !== next.fullChargeKg)
    changed.push(`full charge from ${mass(previous.fullChargeKg)} to ${mass(next.fullChargeKg)}`);
  if (previous.applianceType !== next.applianceType)
    changed.push(
      `appliance type from ${APPLIANCE_TYPE_NAMES[previous.applianceType].toLowerCase()} to ${APPLIANCE_TYPE_NAMES[next.applianceType].toLowerCase()}`,
    );
  if (previous.automaticLeakDetection !== next.automaticLeakDetection)
    changed.push(
      `automatic leak detection from ${ald(previous.automaticLeakDetection)} to ${ald(next.automaticLeakDetection)}`,
    );
  if (previous.inServiceOn !== next.inServiceOn)
    changed.push(
      `in service since ${formatCalendarDay(next.inServiceOn)} (was ${formatCalendarDay(previous.inServiceOn)})`,
    );
  return changed.length ? changed.join("; ") : "no value changed";
}

/** The system's revisions in effect order, each with what it changed from the one before. */
export function revisionHistory<R extends Facts>(revisions: readonly R[], mass: (kg: number) => string) {
  return revisions.map((r, i) => ({ revision: r, changes: revisionChanges(i ? revisions[i - 1] : null, r, mass) }));
}
