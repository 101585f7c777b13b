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
 * Counts one attempt against the limit, atomically in PostgreSQL (one upsert, so concurrent attempts
 * cannot all slip under it), and refuses it with 429 once the window's limit is spent.
 */
export async function takeAttempt(ctx: AppContext, limit: AttemptLimit, key: string, what: string): Promise<void> {
  const rowKey = `${limit.name}|${key}`;
  const resetAt = new Date(Date.now() + limit.windowMs);
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
    .returning();
  if (++takesSincePrune >= 200) {
    takesSincePrune = 0;
    await ctx.db.delete(rateLimitHits).where(lte(rateLimitHits.resetAt, new Date()));
  }
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
