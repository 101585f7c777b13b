import type { DueItem } from "../../contracts/compliance";
import { dueStatus } from "../../domain/compliance/deadlines";
import type { SystemWithStatus } from "./system-records";

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
    link: d.findingId ? `/findings/${d.findingId}` : `/systems/${s.system.id}`,
  }));
}
