import { z } from "zod";
import { text } from "./text";

// GET /api/company/security-log: the owner's view of sign-ins, password and role changes and exports.

export const SECURITY_EVENT_KINDS = [
  "sign-in",
  "sign-in-failed",
  "password-changed",
  "password-reset",
  "role-changed",
  "member-removed",
  "export",
] as const;
export type SecurityEventKind = (typeof SECURITY_EVENT_KINDS)[number];

export const securityEvent = z.object({
  id: z.uuid(),
  kind: z.enum(SECURITY_EVENT_KINDS),
  /** The e-mail of the person the event is about. */
  who: text().nullable(),
  /** The e-mail of the member who did it, when someone else did (a role change). */
  by: text().nullable(),
  detail: z.record(text(), z.union([text(), z.number(), z.null()])),
  ip: text().nullable(),
  at: text(),
});
export const securityLog = z.object({ events: z.array(securityEvent) });
export type SecurityEvent = z.infer<typeof securityEvent>;
