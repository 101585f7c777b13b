import { z } from "zod";
import { MAIL_DELIVERY_STATES } from "./mail-delivery";
import { text } from "./text";

export const outboxMessage = z.object({
  id: z.uuid(),
  from: text(),
  to: z.array(text()),
  subject: text(),
  text: text(),
  html: text().nullable(),
  attachments: z.array(z.object({ filename: text(), contentType: text(), size: z.number() })),
  receivedAt: text(),
});
export type OutboxMessage = z.infer<typeof outboxMessage>;

/** A message of the company's not yet delivered: its report PDF being made, queued, or failed with the reason. */
export const outgoingMessage = z.object({
  id: z.uuid(),
  kind: z.enum(["invitation", "report", "digest", "sign-up"]),
  to: z.array(text()),
  subject: text(),
  state: z.enum(MAIL_DELIVERY_STATES).exclude(["sent"]),
  attempts: z.number(),
  error: text().nullable(),
  queuedAt: text(),
});
export type OutgoingMessage = z.infer<typeof outgoingMessage>;
