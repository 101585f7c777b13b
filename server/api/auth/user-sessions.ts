import { and, ne, sql } from "drizzle-orm";
import type { AppContext } from "../../context";
import { sessions } from "../../db/schema/index";

/** Ends every stored session of a user (the rows connect-pg-simple keeps), except `keepSid` when given. */
export async function endUserSessions(ctx: AppContext, userId: string, keepSid?: string): Promise<number> {
  const ofUser = sql`${sessions.sess}->>'userId' = ${userId}`;
  const rows = await ctx.db
    .delete(sessions)
    .where(keepSid ? and(ofUser, ne(sessions.sid, keepSid)) : ofUser)
    .returning({ sid: sessions.sid });
  return rows.length;
}
