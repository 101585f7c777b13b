import { z } from "zod";
import { text } from "./text";
import { emailSchema, idSchema, passwordSchema, personNameSchema } from "./common";
import { ROLES } from "../domain/roles";
import { lengthUnitSchema, massUnitSchema, numberFormatSchema } from "./units";

export const signInInput = z.object({
  email: emailSchema,
  password: text().min(1, "is required").max(200, "must be at most 200 characters"),
});
export type SignInInput = z.infer<typeof signInInput>;

export const passwordResetRequestInput = z.object({ email: emailSchema });
export const passwordResetConfirmInput = z.object({
  token: text().min(20, "is not a valid reset link").max(200),
  password: passwordSchema,
});

export const membershipSummary = z.object({
  companyId: idSchema,
  companyName: text(),
  role: z.enum(ROLES),
});

/** What the client knows about the signed-in person; `csrfToken` goes in the X-CSRF-Token header. */
export const sessionInfo = z.object({
  user: z
    .object({
      id: idSchema,
      email: text(),
      name: text(),
      lengthUnit: lengthUnitSchema.nullable(),
      massUnit: massUnitSchema.nullable(),
    })
    .nullable(),
  activeCompanyId: idSchema.nullable(),
  memberships: z.array(membershipSummary),
  csrfToken: text(),
  /** True when mail goes to the built-in fake SMTP server (demo and tests): the Outbox is then shown. */
  outboxEnabled: z.boolean(),
  /** The units to show: the person's own choice, else the active company's default. */
  /** `number` is the company's number format; a session kept on a device from before it reads as 1,234.5. */
  units: z.object({ length: lengthUnitSchema, mass: massUnitSchema, number: numberFormatSchema.default("1,234.5") }),
  /** Whose rules the safety cautions name (the company's rule profile); a session kept from before reads as "us". */
  rules: z.enum(["us", "eu"]).default("us"),
});
export type SessionInfo = z.infer<typeof sessionInfo>;

export const switchCompanyInput = z.object({ companyId: idSchema });

export const profileUpdateInput = z.object({
  name: personNameSchema,
  lengthUnit: lengthUnitSchema.nullable(),
  massUnit: massUnitSchema.nullable(),
});
export type ProfileUpdateInput = z.infer<typeof profileUpdateInput>;

/** A signed-in member changes their own password (the current one proves it is them). */
export const passwordChangeInput = z.object({
  currentPassword: text().min(1, "is required").max(200, "must be at most 200 characters"),
  newPassword: passwordSchema,
});
export type PasswordChangeInput = z.infer<typeof passwordChangeInput>;

/** One of the signed-in person's sessions; `id` is a digest of the session id, never the id itself. */
export const accountSession = z.object({
  id: text(),
  current: z.boolean(),
  signedInAt: text().nullable(),
  userAgent: text().nullable(),
  expiresAt: text(),
});
export const accountSessions = z.object({ sessions: z.array(accountSession) });
export type AccountSession = z.infer<typeof accountSession>;
