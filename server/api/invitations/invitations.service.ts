import { and, eq, gt, isNull } from "drizzle-orm";
import type { AppContext } from "../../context";
import { companies, invitations, memberships, membershipStores, users } from "../../db/schema/index";
import { newAccountPassword } from "#core/contracts/members";
import { HttpError, badRequest } from "../../lib/http-error";
import { hashToken } from "../../lib/tokens";
import { hashPassword, verifyCredentials } from "../auth/auth.service";

async function openInvitation(ctx: AppContext, token: string) {
  const [row] = await ctx.db
    .select({ invitation: invitations, companyName: companies.name })
    .from(invitations)
    .innerJoin(companies, eq(companies.id, invitations.companyId))
    .where(
      and(
        eq(invitations.tokenHash, hashToken(token)),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, new Date()),
      ),
    );
  if (!row) throw new HttpError(404, "not_found", "This invitation is not valid any more. Ask for a new one.");
  return row;
}

export async function previewInvitation(ctx: AppContext, token: string) {
  const { invitation, companyName } = await openInvitation(ctx, token);
  const [user] = await ctx.db.select({ id: users.id }).from(users).where(eq(users.email, invitation.email));
  return { companyName, email: invitation.email, role: invitation.role, hasAccount: Boolean(user) };
}

/** Joins the invited person to the company, creating their account first when they have none. */
export async function acceptInvitation(ctx: AppContext, token: string, input: { name?: string; password: string }) {
  const { invitation } = await openInvitation(ctx, token);
  const [existing] = await ctx.db.select().from(users).where(eq(users.email, invitation.email));
  let userId: string;
  if (existing) {
    userId = (await verifyCredentials(ctx, invitation.email, input.password)).id;
  } else {
    const fields: Record<string, string> = {};
    if (!input.name) fields.name = "is required";
    const pw = newAccountPassword.safeParse(input.password);
    if (!pw.success) fields.password = pw.error.issues[0].message;
    if (Object.keys(fields).length) throw badRequest("Please check your name and password.", fields);
    const passwordHash = await hashPassword(ctx, input.password);
    const [created] = await ctx.db
      .insert(users)
      .values({ email: invitation.email, name: input.name!, passwordHash })
      .returning();
    userId = created.id;
  }
  await ctx.db.transaction(async (tx) => {
    const taken = await tx
      .update(invitations)
      .set({ acceptedAt: new Date() })
      .where(and(eq(invitations.id, invitation.id), isNull(invitations.acceptedAt)))
      .returning({ id: invitations.id });
    if (!taken.length) throw new HttpError(409, "conflict", "This invitation was just used.");
    const [m] = await tx
      .insert(memberships)
      .values({ companyId: invitation.companyId, userId, role: invitation.role })
      .onConflictDoNothing()
      .returning();
    if (m && invitation.role === "store-contact" && invitation.storeIds.length) {
      await tx
        .insert(membershipStores)
        .values(invitation.storeIds.map((storeId) => ({ membershipId: m.id, storeId })))
        .onConflictDoNothing();
    }
  });
  return { userId, companyId: invitation.companyId };
}
