import { z } from "zod";
import { text } from "./text";

/** A background job that gave up after its retries, as an owner sees it: an e-mail, a field map, a digest. */
export const failedJob = z.object({
  id: z.uuid(),
  kind: z.enum(["invitation", "report", "digest", "analysis"]),
  /** What it was about (the invitation's, report send's or sweep's id), when there is one. */
  subjectId: z.uuid().nullable(),
  /** Recipients of an e-mail; empty for other jobs. */
  to: z.array(text()),
  subject: text(),
  attempts: z.number(),
  reason: text().nullable(),
  queuedAt: text(),
});
export type FailedJob = z.infer<typeof failedJob>;
