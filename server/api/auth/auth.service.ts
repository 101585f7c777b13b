import type { Request } from "express";
import { and, desc, eq, gt, isNull } from "drizzle-orm";
import type { AppContext } from "../../context";
import { passwordResets, users } from "../../db/schema/index";
import { HttpError } from "../../lib/http-error";
import { hashToken, newLinkToken } from "../../lib/tokens";
import { passwordResetMail } from "../../mail/templates";
import { rotateCsrfToken } from "../../middleware/csrf";
import { listMemberships } from "./session-info";
import { logSecurityEvent } from "../../lib/security-log";
import { endUserSessions } from "./user-sessions";
import { bcryptCompare, bcryptHash } from "../../jobs/passwords";

const RESET_VALID_MS = 60 * 60 * 1000;
// Compared against when the e-mail is unknown, so a wrong e-mail costs the same time as a wrong password:
// made once per cost, at the cost real passwords are hashed with. Hashing and comparing run on the CPU pool.
const dummyHashes = new Map<number, Promise<string>>();
export function dummyHashFor(cost: number): Promise<string> {
  let hash = dummyHashes.get(cost);
  if (!hash) {
    dummyHashes.set(cost, (hash = bcryptHash("not-a-real-password", cost)));
    // a failed attempt (a full queue) is not remembered: the next sign-in makes it again
    hash.catch(() => dummyHashes.delete(cost));
  }
  return hash;
}

export async function hashPassword(ctx: AppContext, password: string): Promise<string> {
  return bcryptHash(password, ctx.config.bcryptCost);
}

export async function verifyCredentials(ctx: AppContext, email: string, password: string, req: Request | null = null) {
  const [user] = await ctx.db.select().from(users).where(eq(users.email, email));
  const ok = await bcryptCompare(password, user?.passwordHash ?? (await dummyHashFor(ctx.config.bcryptCost)));
  if (user && !ok) await logSecurityEvent(ctx, req, { kind: "sign-in-failed", companyId: null, userId: user.id });
  if (!user || !ok)
    throw new HttpError(401, "invalid_credentials", "That e-mail and password do not match an account.");
  return user;
}

/** Starts a fresh session for the user (a new session id defeats session fixation). */
export async function startSession(ctx: AppContext, req: Request, userId: string, preferredCompanyId?: string) {
  await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
  const list = await listMemberships(ctx, userId);
  req.session.userId = userId;
  req.session.activeCompanyId = list.find((m) => m.companyId === preferredCompanyId)?.companyId ?? list[0]?.companyId;
  req.session.signedInAt = new Date().toISOString();
  req.session.userAgent = (req.get("user-agent") ?? "").slice(0, 200) || undefined;
  rotateCsrfToken(req);
  await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}

export async function endSession(req: Request) {
  await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
  rotateCsrfToken(req);
}

/**
 * Makes a reset link and mails it. Called after the request is answered, so the answer is the same, in
 * the same time, whether or not the address has an account.
 */
export async function requestPasswordReset(ctx: AppContext, email: string) {
  const [user] = await ctx.db.select().from(users).where(eq(users.email, email));
  if (!user) return;
  const { token, hash } = newLinkToken();
  await ctx.db
    .insert(passwordResets)
    .values({ userId: user.id, tokenHash: hash, expiresAt: new Date(Date.now() + RESET_VALID_MS) });
  const link = `${ctx.config.appUrl}/reset-password/${token}`;
  // Reset mail belongs to no company, so the built-in mail mode's Outbox never lists it: the person
  // running the server finds the link here instead.
  if (ctx.config.outboxEnabled) ctx.logger.info({ to: user.email, link }, "password reset link (built-in mail mode)");
  await ctx.mailer.send({ to: user.email, kind: "password-reset", ...passwordResetMail({ name: user.name, link }) });
}

/** Sets the new password, spends the link and ends every other session of the user. */
export async function confirmPasswordReset(ctx: AppContext, token: string, password: string, keepSid?: string) {
  const passwordHash = await hashPassword(ctx, password);
  const userId = await ctx.db.transaction(async (tx) => {
    const [reset] = await tx
      .select()
      .from(passwordResets)
      .where(
        and(
          eq(passwordResets.tokenHash, hashToken(token)),
          isNull(passwordResets.usedAt),
          gt(passwordResets.expiresAt, new Date()),
        ),
      )
      .for("update");
    // Only the newest link of a user is live: asking again makes the earlier mail useless.
    const [newest] = reset
      ? await tx
          .select({ id: passwordResets.id })
          .from(passwordResets)
          .where(eq(passwordResets.userId, reset.userId))
          .orderBy(desc(passwordResets.createdAt))
          .limit(1)
      : [];
    if (!reset || newest?.id !== reset.id)
      throw new HttpError(400, "invalid_token", "This reset link is not valid any more. Ask for a new one.", {
        token: "is expired, already used or replaced by a newer link",
      });
    await tx
      .update(passwordResets)
      .set({ usedAt: new Date() })
      .where(and(eq(passwordResets.userId, reset.userId), isNull(passwordResets.usedAt)));
    await tx.update(users).set({ passwordHash }).where(eq(users.id, reset.userId));
    return reset.userId;
  });
  await logSecurityEvent(ctx, null, { kind: "password-reset", companyId: null, userId });
  await endUserSessions(ctx, userId, keepSid);
}
