import { index, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { NUMBER_FORMATS } from "#core/domain/numbers/number-format";

/**
 * A company sign-up waiting for its e-mail to be confirmed. Nothing else exists until the link is
 * opened: no company, no user, so an unconfirmed address never holds an account.
 */
export const companySignups = pgTable(
  "company_signups",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyName: text().notNull(),
    name: text().notNull(),
    email: text().notNull(),
    passwordHash: text().notNull(),
    ruleProfile: text({ enum: ["us-federal", "eu-fgas"] }).notNull(),
    lengthUnit: text({ enum: ["m", "ft-in"] }).notNull(),
    massUnit: text({ enum: ["kg", "lb"] }).notNull(),
    numberFormat: text({ enum: NUMBER_FORMATS }).notNull().default("1,234.5"),
    // SHA-256 of the e-mailed token, as for password resets.
    tokenHash: text().notNull().unique(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    usedAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("company_signups_email").on(t.email)],
);
