import { boolean, date, doublePrecision, index, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { companies } from "./companies";
import { APPLIANCE_TYPE_VALUES, systems } from "./systems";
import { users } from "./users";

export const SYSTEM_REVISION_KINDS = ["first", "change", "correction", "retrofit"] as const;

/**
 * The dated facts of a system: full charge, refrigerant, appliance type, automatic leak detection
 * and the day it entered service. Each change is a new row in force from `effectiveFrom` (store
 * calendar) until the next one; rows are never edited, so every figure can use the values in force
 * on its own date (docs/decisions/0043-system-revisions.md). `systems` keeps the latest values.
 */
export const systemRevisions = pgTable(
  "system_revisions",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    systemId: uuid()
      .notNull()
      .references(() => systems.id, { onDelete: "restrict" }),
    effectiveFrom: date({ mode: "string" }).notNull(),
    kind: text({ enum: SYSTEM_REVISION_KINDS }).notNull(),
    refrigerantId: text().notNull(),
    fullChargeKg: doublePrecision().notNull(),
    applianceType: text({ enum: APPLIANCE_TYPE_VALUES }).notNull(),
    automaticLeakDetection: boolean().notNull(),
    inServiceOn: date({ mode: "string" }).notNull(),
    reason: text().notNull().default(""),
    /** Null only for the first revisions written from existing systems by the migration. */
    byId: uuid().references(() => users.id),
    recordedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("system_revisions_system").on(t.systemId, t.effectiveFrom)],
);
