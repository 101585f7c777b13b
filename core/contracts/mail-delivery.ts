import { z } from "zod";
import { text } from "./text";

/**
 * Where a queued e-mail stands, shown where it was sent from (report sends, invitations):
 * "preparing" while its attachment (a report's PDF) is being made, then queued, sent or failed.
 */
export const MAIL_DELIVERY_STATES = ["preparing", "queued", "sent", "failed"] as const;
export const mailDelivery = z.object({
  mailId: z.uuid(),
  state: z.enum(MAIL_DELIVERY_STATES),
  attempts: z.number(),
  /**
   * The last failure's reason; while queued it is the reason for the wait before the next try.
   * A report whose PDF could not be made is "failed" with the reason and no delivery attempt.
   */
  error: text().nullable(),
  sentAt: text().nullable(),
});
export type MailDelivery = z.infer<typeof mailDelivery>;
