import { z } from "zod";

export const outboxMessage = z.object({
  id: z.uuid(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  attachments: z.array(z.object({ filename: z.string(), contentType: z.string(), size: z.number() })),
  receivedAt: z.string(),
});
export type OutboxMessage = z.infer<typeof outboxMessage>;
