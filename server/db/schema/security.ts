import { index, integer, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { companies } from "./companies";
import { users } from "./users";
import { SECURITY_EVENT_KINDS } from "#core/contracts/security-log";

/**
 * Attempt counters of the sign-in and password-reset limits (server/lib/attempt-limiter.ts), kept in
 * PostgreSQL so they hold across processes and restarts. One row per limit and key, for one window.
 */
export const rateLimitHits = pgTable("rate_limit_hits", {
  key: text().primaryKey(),
  hits: integer().notNull(),
  resetAt: timestamp({ withTimezone: true }).notNull(),
});

/**
 * What the owner reads on the security log: sign-ins, password and role changes, exports. Events about
 * a person's account (sign-in, password) carry no company and are shown to the owners of every company
 * the person belongs to; the others carry the company they happened in.
 */
export const securityEvents = pgTable(
  "security_events",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid().references(() => companies.id, { onDelete: "cascade" }),
    /** The person the event is about. */
    userId: uuid().references(() => users.id, { onDelete: "cascade" }),
    /** Who did it, when another member did (a role change). */
    actorId: uuid().references(() => users.id, { onDelete: "set null" }),
    kind: text({ enum: SECURITY_EVENT_KINDS }).notNull(),
    detail: jsonb().$type<Record<string, string | number | null>>().notNull().default({}),
    ip: text(),
    at: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("security_events_company_at").on(t.companyId, t.at),
    index("security_events_user_at").on(t.userId, t.at),
  ],
);
