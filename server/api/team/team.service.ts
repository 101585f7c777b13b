import { and, asc, desc, eq, inArray, isNull } from "drizzle-orm";
import type { AppContext } from "../../context";
import { companies, invitations, memberships, membershipStores, stores, users } from "../../db/schema/index";
import type { InviteInput } from "#core/contracts/members";
import { ROLE_LABELS, type Role } from "#core/domain/roles";
import { HttpError, badRequest, conflict, notFound } from "../../lib/http-error";
import { newLinkToken } from "../../lib/tokens";
import { invitationMail } from "../../mail/templates";
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

  const { token, hash } = newLinkToken();
  const [company] = await ctx.db.select().from(companies).where(eq(companies.id, companyId));
  const [inviter] = await ctx.db.select().from(users).where(eq(users.id, inviterId));
  const [row] = await ctx.db
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
  const mail = invitationMail({
    companyName: company.name,
    inviterName: inviter.name,
    roleLabel: ROLE_LABELS[input.role],
    link: `${ctx.config.appUrl}/invite/${token}`,
  });
  await ctx.mailer.send({ to: input.email, companyId, ...mail });
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    storeIds: row.storeIds,
    invitedBy: inviter.name,
    createdAt: row.createdAt.toISOString(),
    expiresAt: row.expiresAt.toISOString(),
    acceptedAt: null,
  };
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
