import type { OutboxMessage } from "#core/contracts/outbox";
import { formatBytes, formatDateTime } from "../../../lib/format";
import { linkify } from "../model/linkify";

/** The plain-text part only: captured HTML is never rendered, so a message cannot run script here. */
export function OutboxMessageView({ message }: { message: OutboxMessage }) {
  return (
    <article className="space-y-4 rounded-md bg-surface p-4 edge" aria-labelledby="message-subject">
      <header className="space-y-1">
        <h2 id="message-subject" className="text-xl font-bold">
          {message.subject || "(no subject)"}
        </h2>
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-muted">
          <dt>From</dt>
          <dd className="break-all">{message.from}</dd>
          <dt>To</dt>
          <dd className="break-all">{message.to.join(", ")}</dd>
          <dt>Received</dt>
          <dd>{formatDateTime(message.receivedAt)}</dd>
        </dl>
      </header>
      <div className="whitespace-pre-wrap break-words">
        {linkify(message.text).map((part, i) =>
          part.kind === "link" ? (
            <a key={i} href={part.href} className="break-all">
              {part.href}
            </a>
          ) : (
            <span key={i}>{part.text}</span>
          ),
        )}
      </div>
      {message.attachments.length > 0 ? (
        <section aria-labelledby="attachments-heading">
          <h3 id="attachments-heading" className="font-bold">
            Attachments
          </h3>
          <ul className="list-disc pl-6">
            {message.attachments.map((a, i) => (
              <li key={`${a.filename}-${i}`}>
                {a.filename}{" "}
                <span className="text-muted">
                  ({a.contentType}, {formatBytes(a.size)})
                </span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </article>
  );
}
