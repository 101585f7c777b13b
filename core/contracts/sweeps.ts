import { z } from "zod";
import { text } from "./text";
import { PLAN_COORD_MAX_M } from "./quantities";

// Sweeps and readings: the request and response shapes shared by the server and the Walk screen.

export const SWEEP_STATUSES = ["in-progress", "submitted", "reviewed"] as const;
export const SAMPLE_POINTS = ["grille", "supply", "return", "floor", "high", "ambient"] as const;
export type SamplePoint = (typeof SAMPLE_POINTS)[number];

/** The product's words for each sample point (docs/product.md). */
export const SAMPLE_POINT_LABELS: Record<SamplePoint, string> = {
  grille: "Case front / grille",
  supply: "Supply air",
  return: "Return air",
  floor: "Floor level",
  high: "High level",
  ambient: "Ambient",
};

/** Top of the instrument range we accept; a pegged display is entered as "at least" its top. */
export const PPM_CEILING = 10_000;
/** Most readings in one upload. */
export const READINGS_BATCH_MAX = 1000;
/**
 * How far a reading's device time may sit before the sweep's start (a tap made just before the
 * start reached the device's clock) and after it (a sweep is walked within a day).
 */
export const READING_BEFORE_START_TOLERANCE_MS = 5 * 60_000;
export const READING_AFTER_START_MAX_MS = 24 * 3_600_000;
/** A device clock may be off from ours by this much before a start or reading time is refused. */
export const DEVICE_CLOCK_TOLERANCE_MS = 24 * 3_600_000;
/** A sweep may be uploaded up to this long after it started (a device offline for weeks). */
export const SWEEP_UPLOAD_MAX_AGE_MS = 60 * 24 * 3_600_000;

const instant = z.iso.datetime({ offset: true, message: "must be a date and time (ISO 8601)" });

export const createSweepInput = z.object({
  /** Made on the device so the sweep can start offline; the server makes one when absent. */
  id: z.uuid("must be a valid id").optional(),
  planId: z.uuid("must be a valid id"),
  detectorId: z.uuid("must be a valid id"),
  systemIds: z
    .array(z.uuid("must be a valid id"), "must be a list of system ids")
    .max(50, "must name at most 50 systems")
    .default([]),
  fans: z.enum(["running", "stopped"], "must be running or stopped"),
  defrost: z.boolean("must be true or false"),
  startedAt: instant.optional(),
});
export type CreateSweepInput = z.input<typeof createSweepInput>;

export const sweepWarning = z.object({
  code: z.enum(["detector-overdue", "detector-blind", "detector-unsure"]),
  message: text(),
  systemId: text().optional(),
});
export type SweepWarning = z.infer<typeof sweepWarning>;

/**
 * A pinpoint pass as the device sends it (PUT /sweeps/:id/passes/:passId, idempotent by id): the air
 * conditions it was walked in are kept as first stored; a resend may add its end.
 */
export const sweepPassInput = z.object({
  fans: z.enum(["running", "stopped"], "must be running or stopped"),
  defrost: z.boolean("must be true or false"),
  /** The fixture the pass covers (its fans stopped, or in defrost); absent or null: the whole store. */
  fixtureId: z.uuid("must be a valid id").nullable().optional(),
  startedAt: instant,
  endedAt: instant.nullable().optional(),
});
export type SweepPassInput = z.input<typeof sweepPassInput>;

export const sweepPass = z.object({
  id: z.uuid(),
  sweepId: z.uuid(),
  /** 2, 3, … in order of start (the first pass is the sweep's own conditions). */
  number: z.number().int().min(2),
  fans: z.enum(["running", "stopped"]),
  defrost: z.boolean(),
  fixtureId: z.uuid().nullable(),
  startedAt: text(),
  endedAt: text().nullable(),
});
export type SweepPass = z.infer<typeof sweepPass>;

export const sweep = z.object({
  id: z.uuid(),
  storeId: z.uuid(),
  planId: z.uuid(),
  detectorId: z.uuid(),
  detectorName: text(),
  technicianId: z.uuid(),
  technicianName: text(),
  systemIds: z.array(z.uuid()),
  fans: z.enum(["running", "stopped"]),
  defrost: z.boolean(),
  status: z.enum(SWEEP_STATUSES),
  transportDelayS: z.number(),
  timeConstantS: z.number(),
  alarmPpm: z.number(),
  warnings: z.array(sweepWarning),
  startedAt: text(),
  submittedAt: text().nullable(),
  reviewedAt: text().nullable(),
  readingsRevision: z.number(),
  readingCount: z.number(),
  /** Pinpoint passes in order of start; a server before passes sent none. */
  passes: z.array(sweepPass).default([]),
});
export type Sweep = z.infer<typeof sweep>;

const coord = (axis: string) =>
  z
    .number(`${axis} must be a number of metres`)
    .finite(`${axis} must be a finite number of metres`)
    .min(-PLAN_COORD_MAX_M, `${axis} must be at least -${PLAN_COORD_MAX_M} m`)
    .max(PLAN_COORD_MAX_M, `${axis} must be at most ${PLAN_COORD_MAX_M} m`);

/** One reading as the device sends it. Plan bounds and times are checked against the sweep. */
export const readingInput = z.object({
  id: z.uuid("must be a valid id"),
  x: coord("x"),
  y: coord("y"),
  takenAt: instant,
  ppm: z
    .number("must be a number of ppm")
    .finite("must be a finite number of ppm")
    .min(0, "must be 0 ppm or more")
    .max(
      PPM_CEILING,
      `must be at most ${PPM_CEILING.toLocaleString("en-US")} ppm (the instrument ceiling); enter a pegged display as over-range`,
    ),
  atLeast: z.boolean("must be true or false").default(false),
  samplePoint: z.enum(SAMPLE_POINTS, `must be one of: ${SAMPLE_POINTS.join(", ")}`),
  note: text("must be text").trim().max(500, "must be at most 500 characters").default(""),
  /** The pinpoint pass it was taken in; absent or null: the first pass (older devices send none). */
  passId: z.uuid("must be a valid id").nullable().optional(),
});
export type ReadingInput = z.input<typeof readingInput>;

/** The batch is read loosely so one bad reading is reported alone instead of failing the batch. */
export const readingsBatchInput = z.object({
  readings: z
    .array(z.unknown(), "must be a list of readings")
    .min(1, "must hold at least one reading")
    .max(READINGS_BATCH_MAX, `must hold at most ${READINGS_BATCH_MAX} readings per request`),
});

export const rejectedReading = z.object({
  index: z.number(),
  id: text().nullable(),
  /** Field → reason, e.g. { ppm: "must be 0 ppm or more" }. */
  reasons: z.record(text(), text()),
});
export type RejectedReading = z.infer<typeof rejectedReading>;

export const readingsBatchResult = z.object({
  stored: z.array(text()),
  /** Already stored by an earlier upload: safe to drop from the device's queue. */
  duplicates: z.array(text()),
  rejected: z.array(rejectedReading),
  readingsRevision: z.number(),
});
export type ReadingsBatchResult = z.infer<typeof readingsBatchResult>;

export const reading = z.object({
  id: z.uuid(),
  sweepId: z.uuid(),
  x: z.number(),
  y: z.number(),
  takenAt: text(),
  ppm: z.number(),
  atLeast: z.boolean(),
  samplePoint: z.enum(SAMPLE_POINTS),
  note: text(),
  /** Null: the first pass. */
  passId: z.uuid().nullable().default(null),
  receivedAt: text(),
  updatedAt: text(),
});
export type Reading = z.infer<typeof reading>;

/** An edit of a reading; `editedAt` is the device's time of the edit (kept in the audit trail). */
export const readingEditInput = readingInput
  .omit({ id: true, takenAt: true, passId: true })
  .extend({ takenAt: instant })
  .partial()
  .extend({ editedAt: instant.optional() });
export type ReadingEditInput = z.input<typeof readingEditInput>;

export const readingAuditEntry = z.object({
  id: z.number(),
  readingId: z.uuid(),
  action: z.enum(["edit", "delete"]),
  before: z.record(text(), z.unknown()),
  after: z.record(text(), z.unknown()).nullable(),
  by: text().nullable(),
  editedAt: text().nullable(),
  receivedAt: text(),
});
export type ReadingAuditEntry = z.infer<typeof readingAuditEntry>;
