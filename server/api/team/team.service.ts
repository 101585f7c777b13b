import { and, asc, desc, eq, gt, inArray, isNull } from "drizzle-orm";
import type { AppContext } from "../../context";
import { companies, invitations, memberships, membershipStores, stores, users } from "../../db/schema/index";
import type { InviteInput } from "#core/contracts/members";
import { ROLE_LABELS, type Role } from "#core/domain/roles";
import { HttpError, badRequest, conflict, notFound } from "../../lib/http-error";
import { newLinkToken } from "../../lib/tokens";
import { invitationMail } from "../../mail/templates";
import { deliveriesFor } from "../../mail/mail-status";
import type { Queueable } from "../../mail/mail-queue";
import { logSecurityEvent } from "../../lib/security-log";

const INVITE_VALID_MS = 7 * 24 * 60 * 60 * 1000;

export async function listTeam(ctx: AppContext, companyId: string) {
  const rows = await ctx.db
    .select({
      membershipId: memberships.id,
      userId: users.id,
      name: users.name,
      email: users.email,
      role: memberships.role,
      joinedAt: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.companyId, companyId))
    .orderBy(asc(users.name));
  const scopes = rows.length
    ? await ctx.db
        .select()
        .from(membershipStores)
        .where(
          inArray(
            membershipStores.membershipId,
            rows.map((r) => r.membershipId),
          ),
        )
    : [];
  const pending = await ctx.db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      storeIds: invitations.storeIds,
      invitedBy: users.name,
      createdAt: invitations.createdAt,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
    })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.invitedById))
    .where(and(eq(invitations.companyId, companyId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
    .orderBy(desc(invitations.createdAt));
  const deliveries = await deliveriesFor(
    ctx.db,
    pending.map((i) => i.id),
  );
  return {
    members: rows.map((r) => ({
      ...r,
      joinedAt: r.joinedAt.toISOString(),
      storeIds: scopes.filter((s) => s.membershipId === r.membershipId).map((s) => s.storeId),
    })),
    invitations: pending.map((i) => ({
      ...i,
      createdAt: i.createdAt.toISOString(),
      expiresAt: i.expiresAt.toISOString(),
      acceptedAt: i.acceptedAt?.toISOString() ?? null,
      delivery: deliveries.get(i.id) ?? null,
    })),
  };
}

/** Every named store must belong to the company; otherwise the scope would leak across companies. */
async function assertCompanyStores(ctx: AppContext, companyId: string, storeIds: string[]) {
  if (!storeIds.length) return;
  const found = await ctx.db
    .select({ id: stores.id })
    .from(stores)
    .where(and(eq(stores.companyId, companyId), inArray(stores.id, storeIds)));
  if (found.length !== new Set(storeIds).size)
    throw badRequest("Some of those stores were not found.", { storeIds: "names a store that is not in this company" });
}

export async function invite(ctx: AppContext, companyId: string, inviterId: string, input: InviteInput) {
  await assertCompanyStores(ctx, companyId, input.storeIds);
  const [existing] = await ctx.db
    .select({ id: memberships.id })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.companyId, companyId), eq(users.email, input.email)));
  if (existing)
    throw new HttpError(409, "conflict", "That person is already a member.", {
      email: "is already a member of this company",
    });

  // Inviting someone again while their invitation is open sends it again: never a second invitation.
  const [open] = await ctx.db
    .select({ id: invitations.id })
    .from(invitations)
    .where(
      and(
        eq(invitations.companyId, companyId),
        eq(invitations.email, input.email),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, new Date()),
      ),
    );
  if (open) return { created: false, invitation: await resendInvitation(ctx, companyId, inviterId, open.id, input) };

  const { token, hash } = newLinkToken();
  const { row, mailId } = await ctx.db.transaction(async (tx) => {
    const [row] = await tx
      .insert(invitations)
      .values({
        companyId,
        email: input.email,
        role: input.role,
        storeIds: input.role === "store-contact" ? input.storeIds : [],
        tokenHash: hash,
        invitedById: inviterId,
        expiresAt: new Date(Date.now() + INVITE_VALID_MS),
      })
      .returning();
    const mailId = await ctx.mailer.queue(await invitationMessage(ctx, row, inviterId, token), tx);
    return { row, mailId };
  });
  await ctx.mailer.notify(mailId);
  return { created: true, invitation: await invitationView(ctx, companyId, row.id) };
}

async function invitationMessage(
  ctx: AppContext,
  row: typeof invitations.$inferSelect,
  inviterId: string,
  token: string,
): Promise<Queueable> {
  const [company] = await ctx.db.select().from(companies).where(eq(companies.id, row.companyId));
  const [inviter] = await ctx.db.select().from(users).where(eq(users.id, inviterId));
  const mail = invitationMail({
    companyName: company.name,
    inviterName: inviter.name,
    roleLabel: ROLE_LABELS[row.role],
    link: `${ctx.config.appUrl}/invite/${token}`,
  });
  return { kind: "invitation", subjectId: row.id, to: row.email, companyId: row.companyId, ...mail };
}

async function invitationView(ctx: AppContext, companyId: string, id: string) {
  const view = (await listTeam(ctx, companyId)).invitations.find((i) => i.id === id);
  if (!view) throw notFound("That invitation");
  return view;
}

/**
 * Sends an open invitation again. A failed message goes back in the queue as it was; otherwise the
 * invitation gets a fresh link (the old one stops working) and a new message. Role and stores may
 * be updated by an invite that repeats the address.
 */
export async function resendInvitation(
  ctx: AppContext,
  companyId: string,
  inviterId: string,
  id: string,
  update?: InviteInput,
) {
  const [row] = await ctx.db
    .select()
    .from(invitations)
    .where(
      and(
        eq(invitations.id, id),
        eq(invitations.companyId, companyId),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
      ),
    );
  if (!row) throw notFound("That invitation");
  const delivery = (await deliveriesFor(ctx.db, [row.id])).get(row.id);
  const sameTerms =
    !update ||
    (update.role === row.role &&
      JSON.stringify(update.role === "store-contact" ? update.storeIds : []) === JSON.stringify(row.storeIds));
  if (delivery?.state === "failed" && sameTerms && row.expiresAt > new Date()) {
    await ctx.mailer.retry(delivery.mailId);
  } else if (delivery?.state !== "queued" || !sameTerms) {
    const { token, hash } = newLinkToken();
    const mailId = await ctx.db.transaction(async (tx) => {
      const [fresh] = await tx
        .update(invitations)
        .set({
          tokenHash: hash,
          expiresAt: new Date(Date.now() + INVITE_VALID_MS),
          ...(update ? { role: update.role, storeIds: update.role === "store-contact" ? update.storeIds : [] } : {}),
        })
        .where(eq(invitations.id, row.id))
        .returning();
      return ctx.mailer.queue(await invitationMessage(ctx, fresh, inviterId, token), tx);
    });
    await ctx.mailer.notify(mailId);
  }
  return invitationView(ctx, companyId, row.id);
}

export async function revokeInvitation(ctx: AppContext, companyId: string, id: string) {
  const done = await ctx.db
    .update(invitations)
    .set({ revokedAt: new Date() })
    .where(
      and(
        eq(invitations.id, id),
        eq(invitations.companyId, companyId),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
      ),
    )
    .returning({ id: invitations.id });
  if (!done.length) throw notFound("That invitation");
}

async function ownerCount(ctx: AppContext, companyId: string) {
  const owners = await ctx.db
    .select({ id: memberships.id })
    .from(memberships)
    .where(and(eq(memberships.companyId, companyId), eq(memberships.role, "owner")));
  return owners.length;
}

async function findMembership(ctx: AppContext, companyId: string, membershipId: string) {
  const [m] = await ctx.db
    .select()
    .from(memberships)
    .where(and(eq(memberships.id, membershipId), eq(memberships.companyId, companyId)));
  if (!m) throw notFound("That member");
  return m;
}

export async function updateMember(
  ctx: AppContext,
  companyId: string,
  membershipId: string,
  role: Role,
  storeIds: string[],
  actorId: string,
) {
  const m = await findMembership(ctx, companyId, membershipId);
  if (m.role === "owner" && role !== "owner" && (await ownerCount(ctx, companyId)) <= 1) {
    throw conflict("A company needs at least one owner. Make someone else an owner first.");
  }
  await assertCompanyStores(ctx, companyId, storeIds);
  await ctx.db.transaction(async (tx) => {
    await tx.update(memberships).set({ role }).where(eq(memberships.id, m.id));
    await tx.delete(membershipStores).where(eq(membershipStores.membershipId, m.id));
    if (role === "store-contact")
      await tx.insert(membershipStores).values(storeIds.map((storeId) => ({ membershipId: m.id, storeId })));
  });
  if (m.role !== role)
    await logSecurityEvent(ctx, null, {
      kind: "role-changed",
      companyId,
      userId: m.userId,
      actorId,
      detail: { from: m.role, to: role },
    });
  const team = await listTeam(ctx, companyId);
  return team.members.find((x) => x.membershipId === m.id)!;
}

export async function removeMember(ctx: AppContext, companyId: string, membershipId: string, actorId: string) {
  const m = await findMembership(ctx, companyId, membershipId);
  if (m.role === "owner" && (await ownerCount(ctx, companyId)) <= 1) {
    throw conflict("A company needs at least one owner. Make someone else an owner first.");
  }
  await ctx.db.delete(memberships).where(eq(memberships.id, m.id));
  await logSecurityEvent(ctx, null, {
    kind: "member-removed",
    companyId,
    userId: m.userId,
    actorId,
    detail: { role: m.role },
  });
}
