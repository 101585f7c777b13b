import { z } from "zod";
import { caution, chargeInput, system } from "./systems";

const isoDate = z
  .string({ error: "must be a date as YYYY-MM-DD" })
  .regex(/^\d{4}-\d{2}-\d{2}$/, "must be a date as YYYY-MM-DD");
export const EXCLUSIONS = ["retrofit", "new-installation", "seasonal-variance"] as const;

/** Refrigerant put into a system. The day is on the store's calendar (default: its today). */
export const chargeAdditionInput = z.object({
  addedOn: isoDate.optional(),
  amount: chargeInput,
  /** The member who added it; defaults to the one recording. */
  technicianId: z.uuid("must be a valid id").optional(),
  reason: z
    .string({ error: (i) => (i.input === undefined ? "is required (why refrigerant was added)" : "must be text") })
    .trim()
    .min(1, "is required (why refrigerant was added)")
    .max(500, "must be at most 500 characters"),
  findingId: z.uuid("must be a valid id").nullable().default(null),
  /** 40 CFR 82.157: no leak-rate calculation after a retrofit, a new installation or a seasonal variance [S:R1]. */
  excluded: z
    .enum(EXCLUSIONS, { error: `must be one of: ${EXCLUSIONS.join(", ")}` })
    .nullable()
    .default(null),
});
export type ChargeAdditionInput = z.input<typeof chargeAdditionInput>;

const voidReason = z
  .string({ error: (i) => (i.input === undefined ? "is required (why the entry is wrong)" : "must be text") })
  .trim()
  .min(1, "is required (why the entry is wrong)")
  .max(500, "must be at most 500 characters");
export const chargeCorrectionInput = chargeAdditionInput.extend({ voidReason });
export const chargeVoidInput = z.object({ voidReason });

export const leakCheckInput = z.object({
  checkedOn: isoDate.optional(),
  leakFound: z.boolean({ error: "must be true or false" }),
  note: z.string({ error: "must be text" }).trim().max(2000, "must be at most 2,000 characters").default(""),
});

/** Mark a chronic-leaker report filed for one calendar year; the member recording it signs for it. */
export const chronicReportInput = z.object({
  year: z.int("must be a whole calendar year").min(2000, "must be 2000 or later").max(2100, "must be 2100 or earlier"),
  filedOn: isoDate.optional(),
  reference: z.string({ error: "must be text" }).trim().max(200, "must be at most 200 characters").default(""),
  note: z.string({ error: "must be text" }).trim().max(2000, "must be at most 2,000 characters").default(""),
});

export const chargeAddition = z.object({
  id: z.uuid(),
  systemId: z.uuid(),
  addedOn: z.string(),
  amountKg: z.number(),
  enteredValue: z.number(),
  enteredUnit: z.enum(["kg", "lb"]),
  technician: z.string(),
  reason: z.string(),
  excluded: z.enum(EXCLUSIONS).nullable(),
  findingId: z.uuid().nullable(),
  correctsId: z.uuid().nullable(),
  recordedBy: z.string(),
  recordedAt: z.string(),
  voided: z.object({ at: z.string(), by: z.string(), reason: z.string(), byEntryId: z.uuid().nullable() }).nullable(),
});
export type ChargeAdditionView = z.infer<typeof chargeAddition>;

export const leakRateRow = z.object({
  date: z.string(),
  method: z.enum(["annualizing", "rolling-average"]),
  percent: z.number(),
  countedKg: z.number(),
  days: z.number(),
  windowStart: z.string().nullable(),
  additionIds: z.array(z.uuid()),
  partId: z.string().nullable(),
  thresholdPercent: z.number().nullable(),
  exceeds: z.boolean(),
  repairDue: z.string().nullable(),
});

export const dueItemKinds = [
  "repair",
  "initial-test",
  "follow-up-test",
  "recheck-after-repair",
  "inspection",
  "chronic-leaker-report",
  "detector-check",
  "automatic-leak-detection",
  "retrofit-or-retire-plan",
  "retrofit-or-retire",
] as const;
export const dueItem = z.object({
  kind: z.enum(dueItemKinds),
  what: z.string(),
  dueOn: z.string().nullable(),
  state: z.enum(["overdue", "due-today", "due-soon", "upcoming"]),
  daysLeft: z.number().nullable(),
  source: z.string(),
  storeId: z.uuid().nullable(),
  storeName: z.string().nullable(),
  systemId: z.uuid().nullable(),
  systemName: z.string().nullable(),
  findingId: z.uuid().nullable(),
  detectorId: z.uuid().nullable(),
  /** The client path of the records beneath this figure. */
  link: z.string(),
});
export type DueItem = z.infer<typeof dueItem>;

export const systemRecords = z.object({
  system,
  store: z.object({ id: z.uuid(), name: z.string(), timeZone: z.string() }),
  today: z.string(),
  profile: z.object({
    id: z.string(),
    name: z.string(),
    method: z.enum(["annualizing", "rolling-average"]),
    retentionYears: z.number(),
    retentionSource: z.string(),
    /** Whose words and articles the records use: US EPA leak repair, or EU F-gas leak checks. */
    wording: z.enum(["us", "eu"]),
    /** The profile sets leak-rate thresholds (the US parts); the EU regulation sets leak-check intervals instead. */
    leakRateRules: z.boolean(),
  }),
  /** The part's automatic-leak-detection requirement for this system (US Part 84), or null. */
  automaticLeakDetection: z
    .object({ required: z.boolean(), dueOn: z.string().nullable(), reason: z.string(), source: z.string() })
    .nullable(),
  /** How long the records are kept; `keptUntil` is set once the system is retired. */
  retention: z.object({ years: z.number(), source: z.string(), keptUntil: z.string().nullable() }),
  applicability: z.object({
    applies: z.boolean(),
    partId: z.string().nullable(),
    partTitle: z.string().nullable(),
    reason: z.string(),
    thresholdPercent: z.number().nullable(),
    thresholdSource: z.string().nullable(),
  }),
  leakRates: z.array(leakRateRow),
  latest: leakRateRow.nullable(),
  overThreshold: z.boolean(),
  chronic: z.array(
    z.object({
      year: z.number(),
      addedKg: z.number(),
      percent: z.number(),
      chronic: z.boolean(),
      reportDue: z.string().nullable(),
      /** The report marked filed: the day (store calendar), who signed for it, the authority's reference. */
      filed: z
        .object({ on: z.string(), by: z.string(), reference: z.string(), note: z.string(), recordedAt: z.string() })
        .nullable(),
    }),
  ),
  /** What was done to these records beyond the entries themselves (filed reports), newest first. */
  audit: z.array(z.object({ at: z.string(), by: z.string(), action: z.string(), summary: z.string() })),
  /** The chronic-leaker rule of the part in force, from the profile data (null when none applies). */
  chronicRule: z.object({ percent: z.number(), reportBy: z.string(), source: z.string() }).nullable(),
  co2e: z.object({ known: z.boolean(), tonnes: z.number().nullable(), gwp: z.number().nullable(), source: z.string() }),
  leakCheck: z
    .object({
      withLdsMonths: z.number().nullable(),
      withoutLdsMonths: z.number().nullable(),
      appliedMonths: z.number().nullable(),
      ldsRequired: z.boolean(),
      reason: z.string(),
    })
    .nullable(),
  nextInspection: z.object({ dueOn: z.string(), reason: z.string(), source: z.string() }).nullable(),
  due: z.array(dueItem),
  additions: z.array(chargeAddition),
  leakChecks: z.array(
    z.object({ id: z.uuid(), checkedOn: z.string(), leakFound: z.boolean(), note: z.string(), by: z.string() }),
  ),
  cautions: z.array(caution),
});
export type SystemRecordsView = z.infer<typeof systemRecords>;

export const chargeAdditionResponse = z.object({ addition: chargeAddition, records: systemRecords });

export const todayResponse = z.object({
  generatedAt: z.string(),
  stores: z.array(z.object({ id: z.uuid(), name: z.string(), timeZone: z.string(), today: z.string() })),
  due: z.array(dueItem),
  overThreshold: z.array(
    z.object({
      systemId: z.uuid(),
      systemName: z.string(),
      storeId: z.uuid(),
      storeName: z.string(),
      refrigerantId: z.string(),
      percent: z.number(),
      thresholdPercent: z.number(),
      on: z.string(),
      partTitle: z.string(),
      source: z.string(),
      link: z.string(),
    }),
  ),
  /** Every system of the stores shown, with its latest figure: the way into each system's records. */
  systems: z.array(
    z.object({
      id: z.uuid(),
      name: z.string(),
      storeId: z.uuid(),
      storeName: z.string(),
      refrigerantId: z.string(),
      latestPercent: z.number().nullable(),
      latestOn: z.string().nullable(),
      thresholdPercent: z.number().nullable(),
      breachOpen: z.boolean(),
      /** The latest rate is above the threshold but a repair was recorded since (no action due for it). */
      repairedSince: z.boolean().default(false),
      nextInspection: z.string().nullable(),
      link: z.string(),
    }),
  ),
  openFindings: z.array(
    z.object({
      id: z.uuid(),
      storeId: z.uuid(),
      storeName: z.string(),
      systemId: z.uuid().nullable(),
      systemName: z.string().nullable(),
      status: z.string(),
      component: z.string().nullable(),
      foundOn: z.string(),
      deadline: z.string().nullable(),
      deadlineSource: z.string().nullable(),
      link: z.string(),
    }),
  ),
});
export type TodayView = z.infer<typeof todayResponse>;

export const digestSendResult = z.object({
  sent: z.boolean(),
  localDate: z.string(),
  recipients: z.array(z.string()),
  itemCount: z.number(),
  message: z.string(),
});

/** GET /api/compliance/readings: how the company's profile reads rules not confirmed in their text. */
export const readingsResponse = z.object({
  profileName: z.string(),
  readings: z.array(
    z.object({
      text: z.string(),
      kind: z.enum(["profile-value", "product-reading"]),
      decision: z.string().optional(),
    }),
  ),
});
export type ReadingsResponse = z.infer<typeof readingsResponse>;
