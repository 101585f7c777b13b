import { z } from "zod";
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
