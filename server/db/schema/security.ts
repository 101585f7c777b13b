import { integer, pgTable, text, timestamp } from "drizzle-orm/pg-core";

/**
 * Attempt counters of the sign-in and password-reset limits (server/lib/attempt-limiter.ts), kept in
 * PostgreSQL so they hold across processes and restarts. One row per limit and key, for one window.
 */
export const rateLimitHits = pgTable("rate_limit_hits", {
  key: text().primaryKey(),
  hits: integer().notNull(),
  resetAt: timestamp({ withTimezone: true }).notNull(),
});
