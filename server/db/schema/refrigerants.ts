import { doublePrecision, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { companies } from "./companies";
import { users } from "./users";

/**
 * A refrigerant a company entered because the catalogue lacks it; only that company sees or uses it.
 * A system names it as `company:<id>` (core/domain/refrigerants/company-refrigerant.ts). Its facts
 * never change once entered, so past figures never move; it is retired (hidden from the picker), and
 * deleted only while no system names it (docs/decisions/0073).
 */
export const companyRefrigerants = pgTable(
  "company_refrigerants",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    name: text().notNull(),
    /** The name folded for uniqueness within the company (case and spaces ignored). */
    nameKey: text().notNull(),
    safetyClass: text().notNull(),
    /** ods | hfc | hfo | other: stated with a GWP, derived from a composition. */
    substanceClass: text().notNull(),
    /** [{ id, massPercent }] of catalogue refrigerants, or null when a GWP is stated. */
    components: jsonb().$type<{ id: string; massPercent: number }[]>(),
    statedGwp: doublePrecision(),
    statedGwpBasis: text(),
    statedGwpSource: text(),
    molarMass: doublePrecision(),
    enteredById: uuid()
      .notNull()
      .references(() => users.id),
    enteredAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    retiredAt: timestamp({ withTimezone: true }),
  },
  // Also the index for "this company's refrigerants" (company_id leads).
  (t) => [uniqueIndex("company_refrigerants_name").on(t.companyId, t.nameKey)],
);
