import { z } from "zod";
import { text } from "./text";
import { emailSchema, idSchema, passwordSchema, personNameSchema } from "./common";
import { ROLES } from "../domain/roles";
import { mailDelivery } from "./mail-delivery";

export const roleSchema = z.enum(ROLES);

export const member = z.object({
  membershipId: idSchema,
  userId: idSchema,
  name: text(),
  email: text(),
  role: roleSchema,
  storeIds: z.array(idSchema),
  joinedAt: text(),
});
export type Member = z.infer<typeof member>;

export const invitation = z.object({
  id: idSchema,
  email: text(),
  role: roleSchema,
  storeIds: z.array(idSchema),
  invitedBy: text(),
  createdAt: text(),
  expiresAt: text(),
  acceptedAt: text().nullable(),
  /** The invitation e-mail's state; null for invitations made before mail went through the queue. */
  delivery: mailDelivery.nullable(),
});
export type Invitation = z.infer<typeof invitation>;

export const teamResponse = z.object({ members: z.array(member), invitations: z.array(invitation) });

const storeScope = z.array(idSchema).max(500, "must name at most 500 stores");

export const inviteInput = z
  .object({ email: emailSchema, role: roleSchema, storeIds: storeScope.default([]) })
  .refine((v) => v.role !== "store-contact" || v.storeIds.length > 0, {
    path: ["storeIds"],
    message: "a store contact must be given at least one store",
  });
export type InviteInput = z.infer<typeof inviteInput>;

export const memberUpdateInput = z
  .object({ role: roleSchema, storeIds: storeScope.default([]) })
  .refine((v) => v.role !== "store-contact" || v.storeIds.length > 0, {
    path: ["storeIds"],
    message: "a store contact must be given at least one store",
  });

/** Public view of an invitation link, before sign-in. */
export const invitationPreview = z.object({
  companyName: text(),
  email: text(),
  role: roleSchema,
  hasAccount: z.boolean(),
});

export const acceptInvitationInput = z.object({
  name: personNameSchema.optional(),
  password: text().min(1, "is required").max(200, "must be at most 200 characters"),
});
export const newAccountPassword = passwordSchema;
