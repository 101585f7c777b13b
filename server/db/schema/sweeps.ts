import {
  boolean,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  text,
  timestamp,
  uuid,
  bigserial,
} from "drizzle-orm/pg-core";
import { companies, stores } from "./companies";
import { detectors } from "./detectors";
import { plans } from "./plans";
import { users } from "./users";

export const SWEEP_STATUS_VALUES = ["in-progress", "submitted", "reviewed"] as const;
export const FANS_VALUES = ["running", "stopped"] as const;
export const SAMPLE_POINT_VALUES = ["grille", "supply", "return", "floor", "high", "ambient"] as const;

/** A warning raised when the sweep started (overdue detector, a refrigerant the detector cannot see). */
export interface SweepWarning {
  code: "detector-overdue" | "detector-blind" | "detector-unsure";
  message: string;
  systemId?: string;
}

/**
 * One walk through one store on one plan version with one detector. The id may be made on the
 * device so a sweep can start offline. The detector's lag figures are copied at the start, so a
 * later edit of the detector never changes how this sweep's readings are corrected.
 */
export const sweeps = pgTable(
  "sweeps",
  {
    id: uuid().primaryKey(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    storeId: uuid()
      .notNull()
      .references(() => stores.id, { onDelete: "cascade" }),
    planId: uuid()
      .notNull()
      .references(() => plans.id, { onDelete: "restrict" }),
    detectorId: uuid()
      .notNull()
      .references(() => detectors.id, { onDelete: "restrict" }),
    technicianId: uuid()
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    systemIds: uuid().array().notNull().default([]),
    fans: text({ enum: FANS_VALUES }).notNull(),
    defrost: boolean().notNull(),
    status: text({ enum: SWEEP_STATUS_VALUES }).notNull().default("in-progress"),
    transportDelayS: doublePrecision().notNull(),
    timeConstantS: doublePrecision().notNull(),
    alarmPpm: doublePrecision().notNull(),
    warnings: jsonb().$type<SweepWarning[]>().notNull().default([]),
    /** Device time of the start (the same clock as the readings' timestamps). */
    startedAt: timestamp({ withTimezone: true }).notNull(),
    submittedAt: timestamp({ withTimezone: true }),
    reviewedAt: timestamp({ withTimezone: true }),
    reviewedById: uuid().references(() => users.id, { onDelete: "set null" }),
    /** Bumped by every reading stored, edited or deleted; an analysis made at another revision is stale. */
    readingsRevision: integer().notNull().default(0),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("sweeps_store").on(t.storeId),
    index("sweeps_plan").on(t.planId),
    index("sweeps_company").on(t.companyId),
  ],
);

/**
 * A pinpoint pass: part of a sweep walked again under other air conditions (fans stopped, a defrost),
 * optionally over one fixture. The sweep's own fans/defrost are its first pass, which has no row: a
 * reading without a pass belongs to it. The id is made on the device, so a resend stores it once.
 */
export const sweepPasses = pgTable(
  "sweep_passes",
  {
    id: uuid().primaryKey(),
    sweepId: uuid()
      .notNull()
      .references(() => sweeps.id, { onDelete: "cascade" }),
    fans: text({ enum: FANS_VALUES }).notNull(),
    defrost: boolean().notNull(),
    /** The fixture (stable id on the sweep's plan) whose fans were stopped or which was in defrost; null = all. */
    fixtureId: uuid(),
    /** Device times of the start and the end (the same clock as the readings' timestamps). */
    startedAt: timestamp({ withTimezone: true, precision: 3 }).notNull(),
    endedAt: timestamp({ withTimezone: true, precision: 3 }),
    startedById: uuid().references(() => users.id, { onDelete: "set null" }),
    receivedAt: timestamp({ withTimezone: true, precision: 3 }).notNull().defaultNow(),
  },
  (t) => [index("sweep_passes_sweep").on(t.sweepId, t.startedAt)],
);

/** One tap on the plan. The id is made on the device, so a retried upload stores it once. */
export const readings = pgTable(
  "readings",
  {
    id: uuid().primaryKey(),
    sweepId: uuid()
      .notNull()
      .references(() => sweeps.id, { onDelete: "cascade" }),
    /** Plan metres, origin top-left, y down. */
    x: doublePrecision().notNull(),
    y: doublePrecision().notNull(),
    /** Device time of the position tap. */
    takenAt: timestamp({ withTimezone: true, precision: 3 }).notNull(),
    ppm: doublePrecision().notNull(),
    /** The display was pegged: the true value is at least `ppm`. */
    atLeast: boolean().notNull().default(false),
    samplePoint: text({ enum: SAMPLE_POINT_VALUES }).notNull(),
    note: text().notNull().default(""),
    /** The pinpoint pass it was taken in; null = the first pass (the sweep's own conditions). */
    passId: uuid().references(() => sweepPasses.id),
    recordedById: uuid().references(() => users.id, { onDelete: "set null" }),
    /** Server receive time of the first upload and of the last edit (the edit rule compares these). */
    receivedAt: timestamp({ withTimezone: true, precision: 3 }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true, precision: 3 }).notNull().defaultNow(),
  },
  (t) => [index("readings_sweep_taken").on(t.sweepId, t.takenAt)],
);

export interface ReadingValues {
  x: number;
  y: number;
  takenAt: string;
  ppm: number;
  atLeast: boolean;
  samplePoint: (typeof SAMPLE_POINT_VALUES)[number];
  note: string;
}

/** Every edit and delete of a reading, with the values before and after. Never updated. */
export const readingAudit = pgTable(
  "reading_audit",
  {
    id: bigserial({ mode: "number" }).primaryKey(),
    sweepId: uuid()
      .notNull()
      .references(() => sweeps.id, { onDelete: "cascade" }),
    readingId: uuid().notNull(),
    action: text({ enum: ["edit", "delete"] }).notNull(),
    before: jsonb().$type<ReadingValues>().notNull(),
    after: jsonb().$type<ReadingValues | null>(),
    byId: uuid().references(() => users.id, { onDelete: "set null" }),
    /** When the device says the edit was made (may be long before it reached us when offline). */
    editedAt: timestamp({ withTimezone: true, precision: 3 }),
    receivedAt: timestamp({ withTimezone: true, precision: 3 }).notNull().defaultNow(),
  },
  (t) => [index("reading_audit_sweep").on(t.sweepId), index("reading_audit_reading").on(t.readingId)],
);
