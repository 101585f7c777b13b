import {
  boolean,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import type { RuleProfile } from "#core/domain/compliance/rule-profile";
import { companies } from "./companies";
import { findings } from "./findings";
import { systems } from "./systems";
import { users } from "./users";

/**
 * Refrigerant put into a system. Rows are never edited: a correction is a new row naming the one
 * it replaces (`correctsId`), and the old row gets `voidedAt` / `voidedById` / `voidReason` — the
 * only columns ever set after insert, so the audit trail shows both.
 */
export const chargeAdditions = pgTable(
  "charge_additions",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    // Records outlive nothing they belong to: a system with records is retired, never deleted.
    systemId: uuid()
      .notNull()
      .references(() => systems.id, { onDelete: "restrict" }),
    addedOn: date({ mode: "string" }).notNull(),
    amountKg: doublePrecision().notNull(),
    /** As typed, for the record (the figures use amountKg). */
    enteredValue: doublePrecision().notNull(),
    enteredUnit: text({ enum: ["kg", "lb"] }).notNull(),
    technicianId: uuid()
      .notNull()
      .references(() => users.id),
    reason: text().notNull(),
    /** No leak-rate calculation at this addition (40 CFR 82.157 exceptions). */
    excluded: text({ enum: ["retrofit", "new-installation", "seasonal-variance"] }),
    findingId: uuid().references(() => findings.id, { onDelete: "set null" }),
    correctsId: uuid(),
    recordedById: uuid()
      .notNull()
      .references(() => users.id),
    recordedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    voidedAt: timestamp({ withTimezone: true }),
    voidedById: uuid().references(() => users.id),
    voidReason: text(),
  },
  (t) => [index("charge_additions_system").on(t.systemId)],
);

/** A leak check or periodic inspection of a system; the next due date runs from the latest one. */
export const leakChecks = pgTable(
  "leak_checks",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    // Records outlive nothing they belong to: a system with records is retired, never deleted.
    systemId: uuid()
      .notNull()
      .references(() => systems.id, { onDelete: "restrict" }),
    checkedOn: date({ mode: "string" }).notNull(),
    leakFound: boolean().notNull(),
    note: text().notNull().default(""),
    byId: uuid()
      .notNull()
      .references(() => users.id),
    recordedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("leak_checks_system").on(t.systemId)],
);

/**
 * A check of the system's leak detection system itself (EU: at least every 12 months where one is
 * mandatory, docs/reference/standards.md §2 [S:E2,E5]). A record of its own kind: never edited,
 * kept like the leak checks, each one on the compliance audit trail.
 */
export const leakDetectionChecks = pgTable(
  "leak_detection_checks",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    // Records outlive nothing they belong to: a system with records is retired, never deleted.
    systemId: uuid()
      .notNull()
      .references(() => systems.id, { onDelete: "restrict" }),
    checkedOn: date({ mode: "string" }).notNull(),
    /** The detection system worked as it should (alarm at its set point, sensors and wiring sound). */
    working: boolean().notNull(),
    note: text().notNull().default(""),
    byId: uuid()
      .notNull()
      .references(() => users.id),
    recordedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("leak_detection_checks_system").on(t.systemId)],
);

/** One row per company and local day a digest went out: the unique key is what stops a second send. */
export const digestRuns = pgTable(
  "digest_runs",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    localDate: date({ mode: "string" }).notNull(),
    status: text({ enum: ["sending", "sent"] }).notNull(),
    trigger: text({ enum: ["schedule", "manual"] }).notNull(),
    recipients: text().array().notNull().default([]),
    itemCount: integer().notNull().default(0),
    startedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp({ withTimezone: true }),
  },
  (t) => [uniqueIndex("digest_runs_company_date").on(t.companyId, t.localDate)],
);

/**
 * A company's custom rule profile (thresholds, deadlines, intervals, each with its source), kept
 * as data because regulations and company policies change. One row per save: the latest row is
 * in force, the earlier ones show which rules applied when.
 */
export const customRuleProfiles = pgTable(
  "custom_rule_profiles",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    profile: jsonb().$type<RuleProfile>().notNull(),
    savedById: uuid()
      .notNull()
      .references(() => users.id),
    savedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("custom_rule_profiles_company").on(t.companyId, t.savedAt)],
);

/**
 * A chronic-leaker report marked filed: the calendar year it covers, the day it was filed (store
 * calendar) and the member who signs for it. Never edited; one per system and year.
 */
export const chronicLeakerReports = pgTable(
  "chronic_leaker_reports",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    // Records outlive nothing they belong to: a system with records is retired, never deleted.
    systemId: uuid()
      .notNull()
      .references(() => systems.id, { onDelete: "restrict" }),
    year: integer().notNull(),
    filedOn: date({ mode: "string" }).notNull(),
    /** The authority's receipt or submission number, if any. */
    reference: text().notNull().default(""),
    note: text().notNull().default(""),
    filedById: uuid()
      .notNull()
      .references(() => users.id),
    recordedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("chronic_leaker_reports_system_year").on(t.systemId, t.year)],
);

export const COMPLIANCE_AUDIT_ACTIONS = [
  "chronic-report-filed",
  "system-retired",
  "leak-detection-checked",
  "system-hermetic-changed",
  "system-revised",
  "reading-accepted",
  "reading-withdrawn",
  "refrigerant-entered",
  "refrigerant-retired",
  "refrigerant-restored",
  "refrigerant-deleted",
  "finding-closed-left-service",
] as const;

/** What was done to a system's compliance records, by whom and when (append-only). */
export const complianceAudit = pgTable(
  "compliance_audit",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    systemId: uuid().references(() => systems.id, { onDelete: "restrict" }),
    action: text({ enum: COMPLIANCE_AUDIT_ACTIONS }).notNull(),
    summary: text().notNull(),
    byId: uuid()
      .notNull()
      .references(() => users.id),
    at: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("compliance_audit_system").on(t.systemId, t.at)],
);

/**
 * An owner's acceptance of one "reading" of the rule profile (a rule applied without its text
 * confirmed), in the words the owner saw. Appended, never edited: changed wording is a new reading
 * to accept. The compliance audit trail records each acceptance too.
 */
export const readingAcceptances = pgTable(
  "reading_acceptances",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    /** The profile the reading belongs to ("us-federal", "eu-fgas" or "custom"). */
    profileId: text().notNull(),
    /** The reading's words as listed when accepted. */
    text: text().notNull(),
    note: text().notNull().default(""),
    byId: uuid()
      .notNull()
      .references(() => users.id),
    at: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("reading_acceptances_company").on(t.companyId, t.profileId)],
);

/**
 * An owner's withdrawal of an acceptance, with the reason. Appended, never edited: the acceptance
 * row stays, so history shows both; the reading reads as not accepted until accepted again
 * (docs/decisions/0048-accepting-readings.md).
 */
export const readingWithdrawals = pgTable(
  "reading_withdrawals",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    acceptanceId: uuid()
      .notNull()
      .references(() => readingAcceptances.id, { onDelete: "restrict" }),
    reason: text().notNull(),
    byId: uuid()
      .notNull()
      .references(() => users.id),
    at: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("reading_withdrawals_acceptance").on(t.acceptanceId)],
);
