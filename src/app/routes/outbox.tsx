import { Link, useParams } from "react-router";
import { can } from "#core/domain/roles";
import { Alert } from "../../components/ui/alert";
import { Button } from "../../components/ui/button";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { useOutbox } from "../../features/outbox/api/get-outbox";
import { useOnItsWay } from "../../features/outbox/api/get-on-its-way";
import { OnItsWayList } from "../../features/outbox/components/on-its-way-list";
import { OutboxList } from "../../features/outbox/components/outbox-list";
import { OutboxMessageView } from "../../features/outbox/components/outbox-message-view";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";
import { Component as NotFound } from "./not-found";

export function Component() {
  useDocumentTitle("Outbox");
  const { session, membership } = useSignedIn();
  const { messageId } = useParams();
  const allowed = session.outboxEnabled && can(membership.role, "outbox.read");
  // Asking would only earn a 404 or 403: do not.
  const outbox = useOutbox({ enabled: allowed });
  const onItsWay = useOnItsWay({ enabled: allowed });

  if (!allowed) return <NotFound />;
  const selected = messageId ? outbox.data?.find((m) => m.id === messageId) : undefined;
  return (
    <>
      <PageHeader
        title="Outbox"
        description="Mail this installation has sent, caught by its built-in mail server instead of going out. Invitation links can be followed from here; password-reset links are never listed here (they belong to no company) and are printed in the server's log instead."
        actions={
          <Button variant="secondary" busy={outbox.isFetching} onClick={() => void outbox.refetch()}>
            Check for new mail
          </Button>
        }
      />
      {onItsWay.data ? <OnItsWayList messages={onItsWay.data} /> : null}
      {onItsWay.isError ? (
        <QueryError error={onItsWay.error} what="the mail not delivered yet" onRetry={() => void onItsWay.refetch()} />
      ) : null}
      {outbox.isPending ? <Spinner label="Loading messages…" /> : null}
      {outbox.isError ? (
        <QueryError error={outbox.error} what="the Outbox" onRetry={() => void outbox.refetch()} />
      ) : null}
      {outbox.data ? (
        <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
          <OutboxList messages={outbox.data} selectedId={messageId} linkTo={(id) => `/outbox/${id}`} />
          <div>
            {selected ? <OutboxMessageView message={selected} /> : null}
            {messageId && !selected ? (
              <Alert tone="note" title="Message not found">
                It may have been cleared. <Link to="/outbox">Back to the Outbox</Link>
              </Alert>
            ) : null}
            {!messageId && outbox.data.length > 0 ? <p className="text-muted">Choose a message to read it.</p> : null}
          </div>
        </div>
      ) : null}
    </>
  );
}
