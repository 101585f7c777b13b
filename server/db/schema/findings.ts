import { date, doublePrecision, index, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { companies, stores } from "./companies";
import { plans } from "./plans";
import { sweeps } from "./sweeps";
import { systems } from "./systems";
import { users } from "./users";

export const FINDING_STATUS_VALUES = ["suspected", "confirmed", "repaired", "verified", "closed", "dismissed"] as const;
export const FINDING_EVENT_KINDS = [
  "found",
  "confirmed",
  "repaired",
  "initial-test",
  "follow-up-test",
  "closed",
  "closed-left-service",
  "dismissed",
] as const;

/**
 * A leak record. The status is the latest event's; the events are the signed, dated history and
 * are only ever appended. A finding keeps its record when its sweep is removed (sweepId set null).
 */
export const findings = pgTable(
  "findings",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    storeId: uuid()
      .notNull()
      .references(() => stores.id, { onDelete: "cascade" }),
    systemId: uuid().references(() => systems.id, { onDelete: "set null" }),
    planId: uuid().references(() => plans.id, { onDelete: "set null" }),
    sweepId: uuid().references(() => sweeps.id, { onDelete: "set null" }),
    /** Fixture ids are stable across plan versions, so this is the fixture's id, not a row id. */
    fixtureId: uuid(),
    x: doublePrecision(),
    y: doublePrecision(),
    component: text(),
    source: text({ enum: ["walk", "suspect-spot", "manual"] }).notNull(),
    status: text({ enum: FINDING_STATUS_VALUES }).notNull(),
    note: text().notNull().default(""),
    dismissReason: text({ enum: ["benign-source", "no-leak-found", "other"] }),
    foundAt: timestamp({ withTimezone: true }).notNull(),
    foundById: uuid()
      .notNull()
      .references(() => users.id),
    /** Made on the device so an offline retry stores the finding once. */
    clientId: uuid(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("findings_store").on(t.storeId),
    index("findings_system").on(t.systemId),
    uniqueIndex("findings_company_client").on(t.companyId, t.clientId),
  ],
);

export const findingEvents = pgTable(
  "finding_events",
  {
    id: uuid().primaryKey().defaultRandom(),
    findingId: uuid()
      .notNull()
      .references(() => findings.id, { onDelete: "cascade" }),
    kind: text({ enum: FINDING_EVENT_KINDS }).notNull(),
    /** The finding's status after this event. */
    status: text({ enum: FINDING_STATUS_VALUES }).notNull(),
    /** The day it happened on the store's calendar. */
    on: date({ mode: "string" }).notNull(),
    at: timestamp({ withTimezone: true }).notNull().defaultNow(),
    byId: uuid()
      .notNull()
      .references(() => users.id),
    result: text({ enum: ["passed", "failed"] }),
    note: text().notNull().default(""),
  },
  (t) => [index("finding_events_finding").on(t.findingId)],
);

export const findingPhotos = pgTable(
  "finding_photos",
  {
    id: uuid().primaryKey().defaultRandom(),
    findingId: uuid()
      .notNull()
      .references(() => findings.id, { onDelete: "cascade" }),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    key: text().notNull(),
    thumbKey: text().notNull(),
    mime: text().notNull(),
    takenAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    byId: uuid()
      .notNull()
      .references(() => users.id),
  },
  (t) => [index("finding_photos_finding").on(t.findingId)],
);
