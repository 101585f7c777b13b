import type { RequestHandler } from "express";
import { ipKeyGenerator, rateLimit, type RateLimitInfo } from "express-rate-limit";

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
 * the batch and would drop readings; a 5xx it simply retries. Counts are per process.
 */
export function syncThrottle(options: Partial<SyncThrottleOptions> = {}): RequestHandler {
  const { limit, windowMs } = { ...SYNC_THROTTLE_DEFAULTS, ...options };
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    // Runs after requireMember, so the member is known; the address is only a fallback.
    keyGenerator: (req) => req.auth?.user.id ?? `ip:${ipKeyGenerator(req.ip ?? "")}`,
    handler: (req, res) => {
      const info = (req as typeof req & { rateLimit?: RateLimitInfo }).rateLimit;
      const reset = info?.resetTime?.getTime() ?? Date.now() + windowMs;
      const seconds = Math.max(1, Math.ceil((reset - Date.now()) / 1000));
      res
        .status(503)
        .set("Retry-After", String(seconds))
        .json({
          error: {
            code: "busy",
            message: `Too many sync requests right now; nothing was lost. Trying again in ${seconds} s.`,
          },
        });
    },
  });
}
