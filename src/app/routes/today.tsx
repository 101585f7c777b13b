import { Link, useSearchParams } from "react-router";
import { can, isStoreScoped } from "#core/domain/roles";
import { Alert } from "../../components/ui/alert";
import { Button } from "../../components/ui/button";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { useToday } from "../../entities/records/records-api";
import { useSendDigestNow } from "../../features/compliance/api/send-digest";
import { TodayView } from "../../features/compliance/components/today-view";
import { AcceptedReadings } from "../../features/compliance/components/accepted-readings";
import { formErrorMessage } from "../../lib/form-errors";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";
import { useUnitPreferences } from "../shell/use-unit-preferences";

export function Component() {
  useDocumentTitle("Today");
  const { membership, session } = useSignedIn();
  const units = useUnitPreferences();
  const [params, setParams] = useSearchParams();
  const storeId = params.get("store");
  // All stores load once; the store filter narrows on the screen (the API also takes ?storeId=).
  const today = useToday();
  const digest = useSendDigestNow();
  const scoped = isStoreScoped(membership.role);
  return (
    <>
      <PageHeader
        title="Today"
        description={
          scoped
            ? "Due dates and findings of the stores shared with you (read only)."
            : "What is due or overdue, systems over threshold and open findings, with the rule behind each deadline."
        }
        actions={
          can(membership.role, "digest.send") ? (
            <Button variant="secondary" busy={digest.isPending} onClick={() => digest.mutate()}>
              Send today's digest now
            </Button>
          ) : null
        }
      />
      {digest.data ? (
        <div className="mb-4">
          <Alert tone={digest.data.sent ? "success" : "info"}>
            {digest.data.message}{" "}
            {session.outboxEnabled ? (
              <Link className="text-accent underline" to="/outbox">
                Open the Outbox
              </Link>
            ) : null}
          </Alert>
        </div>
      ) : null}
      {digest.error ? (
        <div className="mb-4">
          <Alert tone="error">{formErrorMessage(digest.error)}</Alert>
        </div>
      ) : null}
      {today.isPending ? <Spinner label="Loading what is due…" /> : null}
      {today.isError ? (
        <QueryError error={today.error} what="the Today list" onRetry={() => void today.refetch()} />
      ) : null}
      {today.data ? (
        <AcceptedReadings>
          <TodayView
            data={today.data}
            storeId={storeId}
            numberFormat={units.number}
            onStoreChange={(id) => setParams(id ? { store: id } : {}, { replace: true })}
          />
        </AcceptedReadings>
      ) : null}
    </>
  );
}
