import { Link } from "react-router";
import type { OutboxMessage } from "#core/contracts/outbox";
import { DataTable } from "../../../components/ui/data-table";
import { EmptyState } from "../../../components/ui/empty-state";
import { formatDateTime } from "../../../lib/format";

const attachmentsOf = (m: OutboxMessage) =>
  m.attachments.length === 0
    ? "no attachment"
    : m.attachments.some((a) => a.contentType === "application/pdf")
      ? "PDF attached"
      : "other attachment";

/** The caught messages, newest first, searchable by subject, recipient and body, and filterable by attachment. */
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
    <DataTable<OutboxMessage>
      caption="Messages, newest first"
      rows={messages}
      rowKey={(m) => m.id}
      search="Search messages"
      columns={[
        {
          header: "Message",
          sortValue: (m) => m.subject,
          searchText: (m) => `${m.subject} ${m.to.join(" ")} ${m.text}`,
          cell: (m) => (
            <Link
              to={linkTo(m.id)}
              aria-current={m.id === selectedId ? "true" : undefined}
              className={`-mx-1 block rounded px-1 no-underline text-ink hover:bg-accent-soft ${m.id === selectedId ? "bg-accent-soft" : ""}`}
            >
              <span className="block font-bold">{m.subject || "(no subject)"}</span>
              <span className="block break-all text-muted">To {m.to.join(", ")}</span>
            </Link>
          ),
        },
        {
          header: "Received",
          className: "whitespace-nowrap",
          sortValue: (m) => m.receivedAt,
          cell: (m) => <span className="text-sm text-muted">{formatDateTime(m.receivedAt)}</span>,
        },
        {
          header: "Attachment",
          filterValue: attachmentsOf,
          cell: (m) => <span className="text-sm">{attachmentsOf(m)}</span>,
        },
      ]}
    />
  );
}
