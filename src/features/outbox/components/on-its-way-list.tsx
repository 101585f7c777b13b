import type { OutgoingMessage } from "#core/contracts/outbox";
import { MailDeliveryStatus } from "../../../components/mail-delivery-status";
import { formatDateTime } from "../../../lib/format";

/**
 * Mail not caught yet: a report whose PDF is being made, a message waiting for the mail server, or one
 * that failed with the reason. A polite live region, so a change of state is announced.
 */
export function OnItsWayList({ messages }: { messages: readonly OutgoingMessage[] }) {
  return (
    <section aria-labelledby="on-its-way" className="mb-6 space-y-1">
      <h2 id="on-its-way" className="text-lg font-bold">
        Not delivered yet
      </h2>
      <div aria-live="polite" data-testid="on-its-way">
        {messages.length === 0 ? (
          <p className="text-sm text-muted">Nothing is waiting: everything sent has arrived below.</p>
        ) : (
          <ul className="space-y-1 text-sm">
            {messages.map((m) => (
              <li key={m.id}>
                <span className="font-bold">{m.subject || "(no subject)"}</span>{" "}
                <span className="break-all text-muted">
                  to {m.to.join(", ")}, {formatDateTime(m.queuedAt)}.
                </span>{" "}
                <MailDeliveryStatus
                  delivery={{ mailId: m.id, state: m.state, attempts: m.attempts, error: m.error, sentAt: null }}
                />
              </li>
            ))}
          </ul>
        )}
      </div>
    </section>
  );
}
