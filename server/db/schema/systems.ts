import { boolean, date, doublePrecision, index, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { companies, stores } from "./companies";
import { users } from "./users";

export const APPLIANCE_TYPE_VALUES = ["commercial-refrigeration", "industrial-process", "comfort-cooling"] as const;

/** Why a system left service: the reason's kind; `other` carries its words in `retireReason`. */
export const RETIRE_REASON_KINDS = ["replaced", "removed", "store-closed", "other"] as const;

/**
 * A rack or condensing unit of a store. The charge is kept in kg whatever unit it was typed in. The
 * dated facts (charge, refrigerant, type, detection, in-service day) also live in `system_revisions`;
 * these columns hold the latest values.
 */
export const systems = pgTable(
  "systems",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    storeId: uuid()
      .notNull()
      .references(() => stores.id, { onDelete: "cascade" }),
    name: text().notNull(),
    /** ASHRAE 34 designation as in core/domain/refrigerants (e.g. "R-448A"). */
    refrigerantId: text().notNull(),
    fullChargeKg: doublePrecision().notNull(),
    applianceType: text({ enum: APPLIANCE_TYPE_VALUES }).notNull(),
    automaticLeakDetection: boolean().notNull().default(false),
    /**
     * Factory-sealed equipment labelled as hermetically sealed: below the EU profile's limit it owes no
     * periodic leak check. A property of the equipment, not a dated fact
     * (docs/decisions/0122-hermetically-sealed-is-a-property.md).
     */
    hermeticallySealed: boolean().notNull().default(false),
    /** The day it entered service (store calendar); null on rows from before it was asked: the day it was entered. */
    inServiceOn: date({ mode: "string" }),
    /**
     * Set when the system left service. A system with records is retired instead of deleted, so its
     * records stay for the profile's retention period (docs/decisions/0040-no-record-is-lost.md).
     */
    retiredAt: timestamp({ withTimezone: true }),
    retiredById: uuid().references(() => users.id),
    /** The day it left service (store calendar); null on rows retired before it was asked: the day of `retiredAt`. */
    retiredOn: date({ mode: "string" }),
    retireReasonKind: text({ enum: RETIRE_REASON_KINDS }),
    /** The reason's words: required for `other`, a note otherwise. */
    retireReason: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("systems_store").on(t.storeId)],
);
