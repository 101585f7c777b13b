import type { SystemRecordsView } from "#core/contracts/compliance";
import { readableAuditEntry } from "#core/domain/compliance/audit-entry";

/**
 * The system's compliance audit trail, newest first, each moment on the store's clock with its zone
 * named and the days in the summaries written as the records write days (docs/decisions/0125).
 */
export function AuditTrail({ r }: { r: Pick<SystemRecordsView, "audit" | "store"> }) {
  if (!r.audit.length) return null;
  return (
    <>
      <h3 className="font-bold">Audit trail</h3>
      <ul className="space-y-1 text-sm" aria-label="Audit trail">
        {r.audit.map((a) => {
          const e = readableAuditEntry(a, r.store.timeZone);
          return (
            <li key={`${a.at}-${a.summary}`}>
              <time dateTime={a.at}>{e.when}</time>, {e.by}: {e.summary}
            </li>
          );
        })}
      </ul>
    </>
  );
}
