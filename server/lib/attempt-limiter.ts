import { lte, sql } from "drizzle-orm";
import type { Request } from "express";
import { ipKeyGenerator } from "express-rate-limit";
import type { AppContext } from "../context";
import { rateLimitHits } from "../db/schema/index";
import { HttpError } from "./http-error";

export interface AttemptLimit {
  /** Names the counter, e.g. "sign-in:client+email". */
  name: string;
  limit: number;
  windowMs: number;
}

/** The client as Express sees it: the socket address, or the proxy's word when TRUST_PROXY says so. */
export function clientKey(req: Request): string {
  // IPv6 clients are counted per /56: one household or phone gets many addresses.
  return ipKeyGenerator(req.ip ?? req.socket.remoteAddress ?? "unknown");
}

let takesSincePrune = 0;

/**
 * Counts one hit on a fixed-window counter shared by every process on the database (one atomic
 * upsert, so concurrent hits cannot all slip under a limit) and answers the window's count so far.
 */
export async function countHit(
  ctx: AppContext,
  rowKey: string,
  windowMs: number,
): Promise<{ hits: number; resetAt: Date }> {
  const resetAt = new Date(Date.now() + windowMs);
  const [row] = await ctx.db
    .insert(rateLimitHits)
    .values({ key: rowKey, hits: 1, resetAt })
    .onConflictDoUpdate({
      target: rateLimitHits.key,
      set: {
        hits: sql`case when ${rateLimitHits.resetAt} <= now() then 1 else ${rateLimitHits.hits} + 1 end`,
        resetAt: sql`case when ${rateLimitHits.resetAt} <= now() then excluded.reset_at else ${rateLimitHits.resetAt} end`,
      },
    })
    .returning({ hits: rateLimitHits.hits, resetAt: rateLimitHits.resetAt });
  if (++takesSincePrune >= 200) {
    takesSincePrune = 0;
    await ctx.db.delete(rateLimitHits).where(lte(rateLimitHits.resetAt, new Date()));
  }
  return row;
}

/**
 * Counts one attempt against the limit (countHit) and refuses it with 429 once the window's limit
 * is spent.
 */
export async function takeAttempt(ctx: AppContext, limit: AttemptLimit, key: string, what: string): Promise<void> {
  const row = await countHit(ctx, `${limit.name}|${key}`, limit.windowMs);
  if (row.hits <= limit.limit) return;
  const waitMs = Math.max(0, row.resetAt.getTime() - Date.now());
  const minutes = Math.max(1, Math.ceil(waitMs / 60_000));
  throw new HttpError(
    429,
    "rate_limited",
    `Too many ${what}. Wait ${minutes} minute${minutes === 1 ? "" : "s"} and try again.`,
    undefined,
    { retryAfterSeconds: Math.ceil(waitMs / 1000) },
  );
}

/** Takes back an attempt that succeeded, so only failures count against the limit. */
export async function giveBackAttempt(ctx: AppContext, limit: AttemptLimit, key: string): Promise<void> {
  await ctx.db
    .update(rateLimitHits)
    .set({ hits: sql`greatest(${rateLimitHits.hits} - 1, 0)` })
    .where(sql`${rateLimitHits.key} = ${`${limit.name}|${key}`}`);
}
