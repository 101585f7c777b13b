import type { RequestHandler } from "express";
import type { AppContext } from "../context";
import { clientKey, countHit } from "../lib/attempt-limiter";

export interface SyncThrottleOptions {
  /** Requests per member per window. */
  limit: number;
  windowMs: number;
}

/** Defaults: 600 sync requests a minute per member, ten a second (a Walk pass sends a few). */
export const SYNC_THROTTLE_DEFAULTS: SyncThrottleOptions = { limit: 600, windowMs: 60_000 };

/**
 * Throttles the Walk client's sync writes per signed-in member. Over the limit the answer is 503
 * with Retry-After, never a 4xx: the Walk client takes any 4xx but 401 as a permanent refusal of
 * the batch and would drop readings; a 5xx it simply retries. The count is kept in PostgreSQL
 * (server/lib/attempt-limiter.ts), so the limit holds across every app process (decision 0033).
 */
export function syncThrottle(ctx: AppContext, options: Partial<SyncThrottleOptions> = {}): RequestHandler {
  const { limit, windowMs } = { ...SYNC_THROTTLE_DEFAULTS, ...options };
  return async (req, res, next) => {
    // Runs after requireMember, so the member is known; the address is only a fallback.
    const who = req.auth?.user.id ?? `ip:${clientKey(req)}`;
    const { hits, resetAt } = await countHit(ctx, `sync|${who}`, windowMs);
    const left = Math.max(0, limit - hits);
    const seconds = Math.max(1, Math.ceil((resetAt.getTime() - Date.now()) / 1000));
    // The IETF draft-8 header pair, as the throttle sent before it counted in the database.
    res.set("RateLimit-Policy", `"sync";q=${limit};w=${Math.ceil(windowMs / 1000)}`);
    res.set("RateLimit", `"sync";r=${left};t=${seconds}`);
    if (hits <= limit) return next();
    res
      .status(503)
      .set("Retry-After", String(seconds))
      .json({
        error: {
          code: "busy",
          message: `Too many sync requests right now; nothing was lost. Trying again in ${seconds} s.`,
        },
      });
  };
}
