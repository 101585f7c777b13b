import { z } from "zod";
import { text } from "./text";

/** A background job that gave up after its retries, as an owner sees it (e-mail so far). */
export const failedJob = z.object({
  id: z.uuid(),
  kind: z.enum(["invitation", "report", "digest"]),
  /** What it was about (the invitation's or report send's id), when there is one. */
  subjectId: z.uuid().nullable(),
  to: z.array(text()),
  subject: text(),
  attempts: z.number(),
  reason: text().nullable(),
  queuedAt: text(),
});
export type FailedJob = z.infer<typeof failedJob>;
