import { z } from "zod";
import { text } from "./text";

/** Where a queued e-mail stands, shown where it was sent from (report sends, invitations). */
export const mailDelivery = z.object({
  mailId: z.uuid(),
  state: z.enum(["queued", "sent", "failed"]),
  attempts: z.number(),
  /** The last failure's reason; while queued it is the reason for the wait before the next try. */
  error: text().nullable(),
  sentAt: text().nullable(),
});
export type MailDelivery = z.infer<typeof mailDelivery>;
