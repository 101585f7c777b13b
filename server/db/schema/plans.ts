import {
  boolean,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import type { RoomDoor, Vertex } from "#core/contracts/fixtures";
import type { Similarity } from "#core/analysis/geometry/similarity";
import { companies, stores } from "./companies";
import { systems } from "./systems";
import { users } from "./users";

export const PLAN_SOURCE_VALUES = ["image", "blank"] as const;

/** The line a lead tech drew to calibrate, in display-image pixels, and its typed real length. */
export interface CalibrationLine {
  a: { x: number; y: number };
  b: { x: number; y: number };
  length: { value: number; unit: "m" | "ft" };
}

/**
 * One plan version of a store. A new drawing (or a re-calibration once sweeps exist) is a new
 * row; older rows and everything drawn on them stay as they were.
 */
export const plans = pgTable(
  "plans",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => companies.id, { onDelete: "cascade" }),
    storeId: uuid()
      .notNull()
      .references(() => stores.id, { onDelete: "cascade" }),
    /** 1, 2, 3… per store; the highest is the current plan. */
    version: integer().notNull(),
    source: text({ enum: PLAN_SOURCE_VALUES }).notNull(),
    /** Storage keys (server/storage); null for a blank plan. Versions made by re-calibration share them. */
    originalKey: text(),
    displayKey: text(),
    thumbKey: text(),
    originalMime: text(),
    originalWidthPx: integer(),
    originalHeightPx: integer(),
    /** Size of the display copy (EXIF orientation applied, longest side capped): calibration pixels. */
    imageWidthPx: integer(),
    imageHeightPx: integer(),
    /** Null until calibrated; null for a blank plan, which is sized in metres from the start. */
    metresPerPixel: doublePrecision(),
    calibration: jsonb().$type<CalibrationLine>(),
    /** The plan's extent in metres; null until an image plan is calibrated. */
    widthM: doublePrecision(),
    heightM: doublePrecision(),
    previousPlanId: uuid(),
    /** Maps the previous version's plan metres onto this one's: x' = s·R(θ)·x + t. */
    alignment: jsonb().$type<Similarity>(),
    /** True once the alignment was set from two matched points (not just assumed). */
    alignmentMatched: boolean().notNull().default(false),
    /** Bumped by every fixture save; a save must name the revision it started from. */
    layoutRevision: integer().notNull().default(0),
    createdById: uuid().references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("plans_store_version").on(t.storeId, t.version), index("plans_company").on(t.companyId)],
);

/**
 * A fixture on one plan version, in plan metres (origin top-left, y down). The id is stable
 * across versions, so the key is (plan_id, id).
 */
export const fixtures = pgTable(
  "fixtures",
  {
    planId: uuid()
      .notNull()
      .references(() => plans.id, { onDelete: "cascade" }),
    id: uuid().notNull(),
    kind: text().notNull(),
    label: text().notNull().default(""),
    systemId: uuid().references(() => systems.id, { onDelete: "set null" }),
    hasFans: boolean().notNull().default(false),
    /** Polygon vertices [x, y] in metres, rotation baked in; null for a point fixture. */
    polygon: jsonb().$type<Vertex[]>(),
    pointX: doublePrecision(),
    pointY: doublePrecision(),
    doorCount: integer(),
    door: jsonb().$type<RoomDoor>(),
    note: text(),
    typicalPpm: doublePrecision(),
    /** Drawing order, so a reload draws fixtures in the order they were saved. */
    position: integer().notNull(),
  },
  (t) => [primaryKey({ columns: [t.planId, t.id] }), index("fixtures_system").on(t.systemId)],
);
