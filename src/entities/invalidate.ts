import type { QueryClient, QueryKey } from "@tanstack/react-query";
import { detectorsKeys } from "./detectors/detectors-keys";
import { findingsKeys } from "./findings/findings-keys";
import { plansKeys } from "./plans/plans-keys";
import { recordsKeys } from "./records/records-keys";
import { storesKeys } from "./stores/stores-keys";
import { sweepsKeys } from "./sweeps/sweeps-keys";
import { systemsKeys } from "./systems/systems-keys";

/** The server resources a mutation can change. */
export type Entity = "store" | "plan" | "fixtures" | "system" | "detector" | "sweep" | "finding" | "charge";

/**
 * What goes stale when an entity changes: its own queries and every answer the server derives
 * from it. A mutation names the entity it changed, never another feature's keys, so a finding
 * changed on the field map refreshes Today and the system's records as well.
 */
export const STALE_AFTER: Record<Entity, readonly QueryKey[]> = {
  // Today and the records name the store.
  store: [storesKeys.all, recordsKeys.all],
  // The store page lists the plan versions.
  plan: [plansKeys.all, storesKeys.details()],
  // A plan's fixture count and layout revision; the fixtures themselves are written from the answer.
  fixtures: [plansKeys.all, storesKeys.details()],
  // The store page lists systems; the records and Today show their names and charges.
  system: [systemsKeys.all, storesKeys.details(), recordsKeys.all],
  // Today lists the detectors' calibration checks.
  detector: [detectorsKeys.all, recordsKeys.todays()],
  sweep: [sweepsKeys.all],
  // A finding's status moves deadlines: Today's lists and the system's records; the store page's
  // sweep summary counts each sweep's findings.
  finding: [findingsKeys.all, recordsKeys.all, sweepsKeys.summaries()],
  // A charge addition moves the leak rate, so the repair deadlines of its system's findings.
  charge: [recordsKeys.all, findingsKeys.all],
};

/**
 * Marks everything the change made stale. The promise settles when the entity's own open queries
 * (the first key) are fresh, as a mutation's onSuccess did before: a form that closes once the new
 * row shows must not wait for the answers derived elsewhere, which refetch in the background.
 */
export function invalidateEntity(queryClient: QueryClient, entity: Entity): Promise<void> {
  const [own, ...derived] = STALE_AFTER[entity];
  for (const queryKey of derived) void queryClient.invalidateQueries({ queryKey });
  return queryClient.invalidateQueries({ queryKey: own });
}
