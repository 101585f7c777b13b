import { Link } from "react-router";
import type { OutboxMessage } from "#core/contracts/outbox";
import { EmptyState } from "../../../components/ui/empty-state";
import { formatDateTime } from "../../../lib/format";

export function OutboxList({
  messages,
  selectedId,
  linkTo,
}: {
  messages: readonly OutboxMessage[];
  selectedId?: string;
  linkTo: (id: string) => string;
}) {
  if (messages.length === 0) {
    return (
      <EmptyState title="The Outbox is empty">
        Mail Plumeline sends (invitations, password resets, reports) shows up here.
      </EmptyState>
    );
  }
  return (
    <ul className="divide-y divide-line overflow-hidden rounded-md bg-surface edge" aria-label="Messages, newest first">
      {messages.map((message) => (
        <li key={message.id}>
          <Link
            to={linkTo(message.id)}
            aria-current={message.id === selectedId ? "true" : undefined}
            className={`block min-h-11 px-4 py-3 no-underline text-ink hover:bg-accent-soft ${message.id === selectedId ? "bg-accent-soft" : ""}`}
          >
            <span className="block font-bold">{message.subject || "(no subject)"}</span>
            <span className="block break-all text-muted">To {message.to.join(", ")}</span>
            <span className="block text-sm text-muted">{formatDateTime(message.receivedAt)}</span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
