import type { AccountSession } from "#core/contracts/auth";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { QueryError } from "../../../components/ui/query-error";
import { Spinner } from "../../../components/ui/spinner";
import { formatDateTime } from "../../../lib/format";
import { formErrorMessage } from "../../../lib/form-errors";
import { useAccountSessions, useEndOtherSessions, useEndSession } from "../api/account-sessions";
import { deviceName } from "../model/device-name";

function sessionTimes(s: AccountSession): string {
  const since = s.signedInAt ? `Signed in ${formatDateTime(s.signedInAt)}` : "Sign-in time not recorded";
  return `${since} · ends ${formatDateTime(s.expiresAt)} if unused`;
}

/** Where you are signed in, this device first; any other one can be signed out from here. */
export function SessionsList() {
  const sessions = useAccountSessions();
  const endOne = useEndSession();
  const endOthers = useEndOtherSessions();
  const error = formErrorMessage(endOne.error) ?? formErrorMessage(endOthers.error);
  if (sessions.isError)
    return <QueryError error={sessions.error} what="your sessions" onRetry={() => void sessions.refetch()} />;
  if (!sessions.data) return <Spinner label="Loading your sessions…" />;
  const list = [...sessions.data.sessions].sort((a, b) => Number(b.current) - Number(a.current));
  const others = list.filter((s) => !s.current).length;
  return (
    <div className="space-y-3">
      {error ? <Alert tone="error">{error}</Alert> : null}
      <ul className="space-y-2">
        {list.map((s) => (
          <li
            key={s.id}
            className="flex flex-wrap items-center justify-between gap-2 rounded-md edge bg-surface p-3"
            data-testid="account-session"
          >
            <div>
              <p className="font-bold">
                {deviceName(s.userAgent)}
                {s.current ? " · this device" : ""}
              </p>
              <p className="text-sm text-muted">{sessionTimes(s)}</p>
            </div>
            {s.current ? null : (
              <Button
                variant="secondary"
                busy={endOne.isPending && endOne.variables === s.id}
                onClick={() => endOne.mutate(s.id)}
              >
                Sign out
              </Button>
            )}
          </li>
        ))}
      </ul>
      {others > 0 ? (
        <Button variant="danger" busy={endOthers.isPending} onClick={() => endOthers.mutate()}>
          Sign out everywhere else
        </Button>
      ) : (
        <p className="text-muted">You are signed in on this device only.</p>
      )}
    </div>
  );
}
