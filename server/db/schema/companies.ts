import { index, integer, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { NUMBER_FORMATS } from "#core/domain/numbers/number-format";
import { users } from "./users";

export const companies = pgTable("companies", {
  id: uuid().primaryKey().defaultRandom(),
  name: text().notNull(),
  lengthUnit: text({ enum: ["m", "ft-in"] })
    .notNull()
    .default("m"),
  massUnit: text({ enum: ["kg", "lb"] })
    .notNull()
    .default("kg"),
  /** How numbers are written and read: "1,234.5", "1.234,5" or "1 234,5" (core/domain/numbers/number-format.ts). */
  numberFormat: text({ enum: NUMBER_FORMATS }).notNull().default("1,234.5"),
  ruleProfile: text({ enum: ["us-federal", "eu-fgas", "custom"] })
    .notNull()
    .default("us-federal"),
  leakRateMethod: text({ enum: ["annualizing", "rolling-average"] })
    .notNull()
    .default("annualizing"),
  detectorCheckIntervalDays: integer().notNull().default(30),
  /** Paper of every PDF: "profile" follows the rule profile (Letter in the US, A4 under EU F-gas). */
  paperSize: text({ enum: ["profile", "letter", "a4"] })
    .notNull()
    .default("profile"),
  createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});

export const ROLE_VALUES = ["owner", "lead-tech", "technician", "engineer", "store-contact"] as const;

export const memberships = pgTable(
  "memberships",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    userId: uuid()
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: text({ enum: ROLE_VALUES }).notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("memberships_company_user").on(t.companyId, t.userId), index("memberships_user").on(t.userId)],
);

export const invitations = pgTable(
  "invitations",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    email: text().notNull(),
    role: text({ enum: ROLE_VALUES }).notNull(),
    storeIds: uuid().array().notNull().default([]),
    tokenHash: text().notNull().unique(),
    invitedById: uuid()
      .notNull()
      .references(() => users.id),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    acceptedAt: timestamp({ withTimezone: true }),
    revokedAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("invitations_company").on(t.companyId)],
);

export const stores = pgTable(
  "stores",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    name: text().notNull(),
    address: text().notNull().default(""),
    timeZone: text().notNull().default("UTC"),
    archivedAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("stores_company").on(t.companyId)],
);

/** The stores a store contact's membership may read. */
export const membershipStores = pgTable(
  "membership_stores",
  {
    membershipId: uuid()
      .notNull()
      .references(() => memberships.id, { onDelete: "cascade" }),
    storeId: uuid()
      .notNull()
      .references(() => stores.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.membershipId, t.storeId] })],
);
