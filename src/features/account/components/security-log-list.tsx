import { QueryError } from "../../../components/ui/query-error";
import { Spinner } from "../../../components/ui/spinner";
import { formatDateTime } from "../../../lib/format";
import { useSecurityLog } from "../api/security-log";
import { securityEventText } from "../model/security-event-text";

/** The owner's security log: sign-ins, password and role changes, removals and exports, newest first. */
export function SecurityLogList() {
  const log = useSecurityLog({ enabled: true });
  if (log.isError) return <QueryError error={log.error} what="the security log" onRetry={() => void log.refetch()} />;
  if (!log.data) return <Spinner label="Loading the security log…" />;
  if (log.data.events.length === 0) return <p className="text-muted">Nothing has been logged yet.</p>;
  return (
    <ol className="divide-y divide-line rounded-md edge bg-surface" aria-label="Security log">
      {log.data.events.map((e) => (
        <li key={e.id} className="p-3" data-testid="security-event">
          <p className={e.kind === "sign-in-failed" ? "font-bold text-danger" : ""}>{securityEventText(e)}</p>
          <p className="text-sm text-muted">
            {formatDateTime(e.at)}
            {e.ip ? ` · from ${e.ip}` : ""}
          </p>
        </li>
      ))}
    </ol>
  );
}
