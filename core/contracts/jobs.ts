import { z } from "zod";

/** A background job that gave up after its retries, as an owner sees it (e-mail so far). */
export const failedJob = z.object({
  id: z.uuid(),
  kind: z.enum(["invitation", "report", "digest"]),
  /** What it was about (the invitation's or report send's id), when there is one. */
  subjectId: z.uuid().nullable(),
  to: z.array(z.string()),
  subject: z.string(),
  attempts: z.number(),
  reason: z.string().nullable(),
  queuedAt: z.string(),
});
export type FailedJob = z.infer<typeof failedJob>;
