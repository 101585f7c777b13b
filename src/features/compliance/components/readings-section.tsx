import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { QueryError } from "../../../components/ui/query-error";
import { Spinner } from "../../../components/ui/spinner";
import { formErrorMessage } from "../../../lib/form-errors";
import { useAcceptReading } from "../api/accept-reading";
import { useReadings } from "../api/get-readings";
import { ReadingHistory } from "./reading-history";
import { WithdrawReading } from "./withdraw-reading";

const day = (iso: string) => iso.slice(0, 10);

/**
 * Every "reading" of the company's rule profile, listed once in plain words: how the product
 * applies a rule whose text it has not confirmed. Each "reading" marker on screens and statements
 * links here. The owner accepts each as worded (recorded with who and when, and audited), withdraws
 * an acceptance with a reason (both stay in its history), or changes a value by starting a custom
 * profile (docs/decisions/0048-accepting-readings.md).
 */
export function ReadingsSection({ canAccept = false }: { canAccept?: boolean }) {
  const readings = useReadings();
  const accept = useAcceptReading();
  const acceptError = formErrorMessage(accept.error);
  return (
    <section id="readings" aria-labelledby="readings-heading" className="space-y-2">
      <h2 id="readings-heading" className="text-xl font-bold">
        Readings
      </h2>
      {readings.isPending ? <Spinner label="Loading readings…" /> : null}
      {readings.isError ? (
        <QueryError error={readings.error} what="the readings" onRetry={() => void readings.refetch()} />
      ) : null}
      {acceptError ? <Alert tone="error">{acceptError}</Alert> : null}
      {readings.data ? (
        <>
          <p className="max-w-prose text-sm text-muted">
            Where {readings.data.profileName} is applied without the rule text confirmed, the product follows these
            readings; figures marked “reading” use them. The owner accepts each as it is, or changes a value in a custom
            profile.
          </p>
          <ul className="max-w-prose space-y-3">
            {readings.data.readings.map((r) => (
              <li key={r.text} className="rounded-md bg-surface p-3 edge">
                <p>{r.text}</p>
                {r.accepted ? (
                  <>
                    <p className="mt-1 text-sm text-muted">
                      Accepted by {r.accepted.by} on {day(r.accepted.at)}
                      {r.accepted.note ? ` (${r.accepted.note})` : ""}.
                    </p>
                    {canAccept ? <WithdrawReading text={r.text} /> : null}
                  </>
                ) : canAccept ? (
                  <div className="mt-2 flex flex-wrap items-center gap-2">
                    <Button
                      variant="secondary"
                      busy={accept.isPending && accept.variables?.text === r.text}
                      onClick={() => accept.mutate({ text: r.text, note: "" })}
                      aria-label={`Accept: ${r.text}`}
                    >
                      Accept
                    </Button>
                    <a className="text-sm text-accent underline" href="#custom-profile-heading">
                      Change it in a custom profile
                    </a>
                  </div>
                ) : (
                  <p className="mt-1 text-sm text-muted">Not accepted by the owner yet.</p>
                )}
                <ReadingHistory history={r.history} />
              </li>
            ))}
          </ul>
        </>
      ) : null}
    </section>
  );
}
