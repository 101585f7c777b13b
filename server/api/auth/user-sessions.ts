import { createHash } from "node:crypto";
import { and, gt, ne, sql } from "drizzle-orm";
import type { AppContext } from "../../context";
import { sessions } from "../../db/schema/index";
import type { AccountSession } from "#core/contracts/auth";

/** What the person sees instead of a session id: the id is the cookie's secret, its digest is not. */
export function publicSessionId(sid: string): string {
  return createHash("sha256").update(sid).digest("base64url").slice(0, 22);
}

const ofUser = (userId: string) => sql`${sessions.sess}->>'userId' = ${userId}`;

/** Ends every stored session of a user (the rows connect-pg-simple keeps), except `keepSid` when given. */
export async function endUserSessions(ctx: AppContext, userId: string, keepSid?: string): Promise<number> {
  const rows = await ctx.db
    .delete(sessions)
    .where(keepSid ? and(ofUser(userId), ne(sessions.sid, keepSid)) : ofUser(userId))
    .returning({ sid: sessions.sid });
  return rows.length;
}

/** The user's live sessions, newest sign-in first, the current one marked. */
export async function listUserSessions(ctx: AppContext, userId: string, currentSid: string): Promise<AccountSession[]> {
  const rows = await ctx.db
    .select()
    .from(sessions)
    .where(and(ofUser(userId), gt(sessions.expire, new Date())));
  return rows
    .map((r) => {
      const sess = r.sess as { signedInAt?: string; userAgent?: string };
      return {
        id: publicSessionId(r.sid),
        current: r.sid === currentSid,
        signedInAt: sess.signedInAt ?? null,
        userAgent: sess.userAgent ?? null,
        expiresAt: r.expire.toISOString(),
      };
    })
    .sort((a, b) => (b.signedInAt ?? "").localeCompare(a.signedInAt ?? ""));
}

/** Ends one of the user's own sessions by its public id; false when the user has no such session. */
export async function endUserSession(ctx: AppContext, userId: string, publicId: string): Promise<boolean> {
  const rows = await ctx.db.select({ sid: sessions.sid }).from(sessions).where(ofUser(userId));
  const match = rows.find((r) => publicSessionId(r.sid) === publicId);
  if (!match) return false;
  await ctx.db.delete(sessions).where(and(ofUser(userId), sql`${sessions.sid} = ${match.sid}`));
  return true;
}
