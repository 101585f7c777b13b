import { z } from "zod";
import { text } from "./text";
import { CHARGE_MAX } from "./quantities";
import { idSchema } from "./common";

export const APPLIANCE_TYPES = ["commercial-refrigeration", "industrial-process", "comfort-cooling"] as const;
export const applianceTypeSchema = z.enum(APPLIANCE_TYPES, {
  error: `must be one of: ${APPLIANCE_TYPES.join(", ")}`,
});
export type ApplianceType = z.infer<typeof applianceTypeSchema>;

/** Why a system left service (decision 0124). */
export const RETIRE_REASONS = ["replaced", "removed", "store-closed", "other"] as const;
export const RETIRE_REASON_NAMES: Readonly<Record<(typeof RETIRE_REASONS)[number], string>> = {
  replaced: "Replaced by another system",
  removed: "Removed, not replaced",
  "store-closed": "Store closed",
  other: "Other",
};

export const APPLIANCE_TYPE_NAMES: Readonly<Record<ApplianceType, string>> = {
  "commercial-refrigeration": "Commercial refrigeration",
  "industrial-process": "Industrial process refrigeration",
  "comfort-cooling": "Comfort cooling",
};

/** A charge as typed: kg or lb; the server keeps kg (1 lb = 0.45359237 kg exactly, NIST SP 811). */
export const chargeInput = z.object({
  value: z
    .number({ error: "must be a number" })
    .refine(Number.isFinite, { message: "must be a finite number" })
    .refine((v) => v > 0, { message: "must be more than 0" })
    .refine((v) => v <= CHARGE_MAX, { message: `must be at most ${CHARGE_MAX} (is the unit right?)` }),
  unit: z.enum(["kg", "lb"], { error: "must be kg or lb" }),
});
export type ChargeInput = z.infer<typeof chargeInput>;

const systemFields = {
  name: text({ error: "must be text" }).trim().min(1, "is required").max(120, "must be at most 120 characters"),
  /**
   * An R-number from the catalogue, or `company:<id>` for one of the company's own refrigerants
   * (GET /api/refrigerants lists both); checked on the server.
   */
  refrigerantId: text({ error: "must be an R-number such as R-448A" })
    .trim()
    .min(1, "is required")
    .max(60, "must be at most 60 characters"),
  fullCharge: chargeInput,
  applianceType: applianceTypeSchema,
  automaticLeakDetection: z.boolean({ error: "must be true or false" }),
  /** Factory-sealed and labelled as hermetically sealed (EU: exempt from leak checks below 10 t CO2e). */
  hermeticallySealed: z.boolean({ error: "must be true or false" }).optional(),
};

const isoDay = z
  .string({ error: "must be a date as YYYY-MM-DD" })
  .regex(/^\d{4}-\d{2}-\d{2}$/, "must be a date as YYYY-MM-DD");

export const systemInput = z.object({
  ...systemFields,
  /** The day it entered service (store calendar); defaults to today. */
  inServiceOn: isoDay.optional(),
});
export type SystemInput = z.infer<typeof systemInput>;

export const systemUpdateInput = z
  .object({ ...systemFields, inServiceOn: isoDay })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: "name at least one field to change" });
export type SystemUpdateInput = z.infer<typeof systemUpdateInput>;

export const gwpSummary = z.object({
  value: z.number(),
  /** The GWP-100 basis of the value, e.g. "AR4". */
  basis: text(),
  /** The company profile's stated GWP basis, in words, shown beside the figure. */
  statement: text(),
  source: text(),
});

export const refrigerantSummary = z.object({
  /** The catalogue R-number, or `company:<id>` for a refrigerant the company entered. */
  id: text(),
  name: text(),
  /** What a reader sees: the R-number, or the company's own name for its refrigerant. */
  designation: text(),
  /** Entered by the company, not from the catalogue: shown as such beside every figure. */
  enteredByCompany: z.boolean(),
  safetyClass: text(),
  safetyClassSource: text(),
  /** null when no basis in the list has a value for every component. */
  gwp: gwpSummary.nullable(),
  gwpNote: text().nullable(),
  /**
   * A company refrigerant entered by composition: its catalogue components by mass %, so a device
   * offline can tell which detectors see it as the server does. Absent otherwise.
   */
  components: z.array(z.object({ id: text(), massPercent: z.number().min(0).max(100) })).optional(),
});
export type RefrigerantSummary = z.infer<typeof refrigerantSummary>;

export const caution = z.object({
  id: text(),
  level: z.enum(["warning", "notice"]),
  text: text(),
  source: text(),
});
export type Caution = z.infer<typeof caution>;

export const system = z.object({
  id: idSchema,
  storeId: idSchema,
  name: text(),
  refrigerantId: text(),
  fullChargeKg: z.number(),
  applianceType: applianceTypeSchema,
  automaticLeakDetection: z.boolean(),
  hermeticallySealed: z.boolean(),
  inServiceOn: text(),
  /**
   * Set once the system left service; its records stay readable (never deleted). `on` is the day it
   * left service (store calendar), `at` when that was recorded; `reasonKind` is null on systems
   * retired before the reason was asked.
   */
  retired: z
    .object({ at: text(), on: text(), reasonKind: z.enum(RETIRE_REASONS).nullable(), reason: text() })
    .nullable(),
  /** Any record names it: it can only be retired, never deleted. */
  hasRecords: z.boolean(),
  refrigerant: refrigerantSummary,
  /** The usual cautions for this refrigerant, shown on the system form. */
  cautions: z.array(caution),
  createdAt: text(),
  updatedAt: text(),
});
export type System = z.infer<typeof system>;

export const systemListResponse = z.object({ systems: z.array(system) });

export const systemListQuery = z.object({
  include: z.enum(["retired"], { error: "must be retired (or left out)" }).optional(),
});

/**
 * POST /api/systems/:id/retire: the day it left service (store calendar; not in the future, not
 * before its in-service day, checked on the server) and why. `other` needs the reason in words.
 */
export const retireInput = z
  .object({
    retiredOn: isoDay,
    reasonKind: z.enum(RETIRE_REASONS, { error: `must be one of: ${RETIRE_REASONS.join(", ")}` }),
    reason: text({ error: "must be text" }).trim().max(500, "must be at most 500 characters").default(""),
  })
  .refine((v) => v.reasonKind !== "other" || v.reason.length > 0, {
    message: "say why the system left service",
    path: ["reason"],
  });
export type RetireInput = z.infer<typeof retireInput>;

/** DELETE /api/systems/:id: deleted when it had no record, else retired with every record kept. */
export const systemRemoval = z.discriminatedUnion("outcome", [
  z.object({ outcome: z.literal("deleted"), system: z.null() }),
  z.object({ outcome: z.literal("retired"), system }),
]);
export type SystemRemoval = z.infer<typeof systemRemoval>;
export const refrigerantListResponse = z.object({
  refrigerants: z.array(refrigerantSummary.extend({ cautions: z.array(caution) })),
});

export const REVISION_KINDS = ["change", "correction", "retrofit"] as const;

/**
 * POST /api/systems/:id/revisions: a dated change of the facts the rules read. `change`: the
 * system changed on that day; `correction`: the earlier value was wrong from that day;
 * `retrofit`: a new refrigerant, which starts a new regime (docs/decisions/0043-system-revisions.md).
 */
export const revisionInput = z
  .object({
    effectiveFrom: isoDay,
    kind: z.enum(REVISION_KINDS, { error: `must be one of: ${REVISION_KINDS.join(", ")}` }),
    reason: text({ error: "must be text" }).trim().min(1, "is required").max(500, "must be at most 500 characters"),
    refrigerantId: systemFields.refrigerantId.optional(),
    fullCharge: chargeInput.optional(),
    applianceType: applianceTypeSchema.optional(),
    automaticLeakDetection: systemFields.automaticLeakDetection.optional(),
    inServiceOn: isoDay.optional(),
  })
  .refine(
    (v) =>
      [v.refrigerantId, v.fullCharge, v.applianceType, v.automaticLeakDetection, v.inServiceOn].some(
        (x) => x !== undefined,
      ),
    {
      message:
        "name at least one fact to change: refrigerantId, fullCharge, applianceType, automaticLeakDetection or inServiceOn",
    },
  )
  .refine((v) => v.kind !== "retrofit" || v.refrigerantId !== undefined, {
    message: "a retrofit names the new refrigerant",
    path: ["refrigerantId"],
  });
export type RevisionInput = z.infer<typeof revisionInput>;

export const systemRevision = z.object({
  id: idSchema,
  effectiveFrom: text(),
  kind: z.enum(["first", ...REVISION_KINDS]),
  refrigerantId: text(),
  /** What a reader sees: the R-number, or the company's name for its own refrigerant. */
  refrigerantName: text(),
  fullChargeKg: z.number(),
  applianceType: applianceTypeSchema,
  automaticLeakDetection: z.boolean(),
  inServiceOn: text(),
  reason: text(),
  /** Who recorded it; empty for the first revisions written from existing systems. */
  by: text(),
  recordedAt: text(),
});
export const systemRevisionList = z.object({ revisions: z.array(systemRevision) });
