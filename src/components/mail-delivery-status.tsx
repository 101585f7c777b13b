import type { MailDelivery } from "#core/contracts/mail-delivery";

/** Queued mail is looked at again every few seconds until it is sent or has failed. */
export const MAIL_REFRESH_MS = 3_000;

export function anyQueued(items: readonly { delivery: MailDelivery | null }[] | undefined): boolean {
  return Boolean(items?.some((i) => i.delivery?.state === "queued"));
}

/** Where a queued e-mail stands, in words: waiting, retrying (with why), sent, or not delivered (with why). */
export function MailDeliveryStatus({ delivery }: { delivery: MailDelivery | null }) {
  if (!delivery) return null;
  if (delivery.state === "sent") return <span>E-mail sent.</span>;
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
