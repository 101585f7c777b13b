import type { MailDelivery } from "#core/contracts/mail-delivery";

/** Mail being prepared or queued is looked at again every few seconds until it is sent or has failed. */
export const MAIL_REFRESH_MS = 3_000;

export function anyQueued(items: readonly { delivery: MailDelivery | null }[] | undefined): boolean {
  return Boolean(items?.some((i) => i.delivery?.state === "queued" || i.delivery?.state === "preparing"));
}

/** Where a queued e-mail stands, in words: its PDF being made, waiting, retrying (with why), sent, or not delivered (with why). */
export function MailDeliveryStatus({ delivery }: { delivery: MailDelivery | null }) {
  if (!delivery) return null;
  if (delivery.state === "sent") return <span>E-mail sent.</span>;
  if (delivery.state === "preparing") return <span>Making the PDF: the e-mail goes out once it is ready.</span>;
  // Nothing was tried: the attachment could not be made (the reason says so).
  if (delivery.state === "failed" && delivery.attempts === 0)
    return <strong className="text-red-800">Not sent: {delivery.error ?? "it could not be prepared"}</strong>;
  if (delivery.state === "failed")
    return (
      <strong className="text-red-800">
        Not delivered after {delivery.attempts} tries: {delivery.error ?? "the mail server refused it"}
      </strong>
    );
  return (
    <span>
      {delivery.error
        ? `Waiting to retry (${delivery.attempts} tries so far): ${delivery.error}`
        : "Queued: it goes out in a moment."}
    </span>
  );
}
