import type { DueItem } from "#core/contracts/compliance";
import { dueStatus } from "#core/domain/compliance/deadlines";
import type { SystemWithStatus } from "./system-records";

/** Where on the system records page each kind of figure comes from. */
const SECTION: Record<DueItem["kind"], string> = {
  repair: "leak-rates",
  "initial-test": "sys-findings",
  "follow-up-test": "sys-findings",
  "recheck-after-repair": "checks",
  inspection: "checks",
  "chronic-leaker-report": "chronic",
  "detector-check": "checks",
  "automatic-leak-detection": "sys-due",
  "leak-detection-check": "lds-checks",
  "retrofit-or-retire-plan": "leak-rates",
  "retrofit-or-retire": "leak-rates",
};

/** A system's due dates as Today items, each linking to the records beneath it. */
export function systemDueItems(s: SystemWithStatus, now: Date): DueItem[] {
  return s.status.due.map((d) => ({
    kind: d.kind,
    what: d.what,
    dueOn: d.dueOn,
    ...dueStatus(d.dueOn, now, s.store.timeZone),
    source: d.source,
    storeId: s.store.id,
    storeName: s.store.name,
    systemId: s.system.id,
    systemName: s.system.name,
    findingId: d.findingId ?? null,
    detectorId: null,
    link: d.findingId ? `/findings/${d.findingId}` : `/systems/${s.system.id}#${SECTION[d.kind]}`,
  }));
}
