import { z } from "zod";
import { text } from "./text";
import { caution, chargeInput, system } from "./systems";

const isoDate = text({ error: "must be a date as YYYY-MM-DD" }).regex(
  /^\d{4}-\d{2}-\d{2}$/,
  "must be a date as YYYY-MM-DD",
);
export const EXCLUSIONS = ["retrofit", "new-installation", "seasonal-variance"] as const;
/** How a charge-added entry that counts no leak loss is named to a reader (40 CFR 82.157 [S:R1]). */
export const EXCLUSION_NAMES: Record<(typeof EXCLUSIONS)[number], string> = {
  retrofit: "fill after a retrofit",
  "new-installation": "fill of a new installation",
  "seasonal-variance": "seasonal variance",
};

/** Refrigerant put into a system. The day is on the store's calendar (default: its today). */
export const chargeAdditionInput = z.object({
  addedOn: isoDate.optional(),
  amount: chargeInput,
  /** The member who added it; defaults to the one recording. */
  technicianId: z.uuid("must be a valid id").optional(),
  reason: text({ error: (i) => (i.input === undefined ? "is required (why refrigerant was added)" : "must be text") })
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

const voidReason = text({
  error: (i) => (i.input === undefined ? "is required (why the entry is wrong)" : "must be text"),
})
  .trim()
  .min(1, "is required (why the entry is wrong)")
  .max(500, "must be at most 500 characters");
export const chargeCorrectionInput = chargeAdditionInput.extend({ voidReason });
export const chargeVoidInput = z.object({ voidReason });

export const leakCheckInput = z.object({
  checkedOn: isoDate.optional(),
  leakFound: z.boolean({ error: "must be true or false" }),
  note: text({ error: "must be text" }).trim().max(2000, "must be at most 2,000 characters").default(""),
});

/**
 * A check of the system's leak detection system itself (EU: at least every 12 months where one is
 * mandatory): the day, whether it worked as it should, and what was done.
 */
export const leakDetectionCheckInput = z.object({
  checkedOn: isoDate.optional(),
  working: z.boolean({ error: "must be true or false" }),
  note: text({ error: "must be text" }).trim().max(2000, "must be at most 2,000 characters").default(""),
});

/** Mark a chronic-leaker report filed for one calendar year; the member recording it signs for it. */
export const chronicReportInput = z.object({
  year: z.int("must be a whole calendar year").min(2000, "must be 2000 or later").max(2100, "must be 2100 or earlier"),
  filedOn: isoDate.optional(),
  reference: text({ error: "must be text" }).trim().max(200, "must be at most 200 characters").default(""),
  note: text({ error: "must be text" }).trim().max(2000, "must be at most 2,000 characters").default(""),
});

export const chargeAddition = z.object({
  id: z.uuid(),
  systemId: z.uuid(),
  addedOn: text(),
  amountKg: z.number(),
  enteredValue: z.number(),
  enteredUnit: z.enum(["kg", "lb"]),
  technician: text(),
  reason: text(),
  excluded: z.enum(EXCLUSIONS).nullable(),
  findingId: z.uuid().nullable(),
  correctsId: z.uuid().nullable(),
  recordedBy: text(),
  recordedAt: text(),
  voided: z.object({ at: text(), by: text(), reason: text(), byEntryId: z.uuid().nullable() }).nullable(),
});
export type ChargeAdditionView = z.infer<typeof chargeAddition>;

export const leakRateRow = z.object({
  date: text(),
  method: z.enum(["annualizing", "rolling-average"]),
  percent: z.number(),
  countedKg: z.number(),
  days: z.number(),
  windowStart: text().nullable(),
  additionIds: z.array(z.uuid()),
  partId: text().nullable(),
  thresholdPercent: z.number().nullable(),
  /** The rule of the part in force on the figure's date (after a retrofit, earlier figures keep theirs). */
  thresholdSource: text().nullable(),
  exceeds: z.boolean(),
  repairDue: text().nullable(),
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
  "leak-detection-check",
  "retrofit-or-retire-plan",
  "retrofit-or-retire",
] as const;
export const dueItem = z.object({
  kind: z.enum(dueItemKinds),
  what: text(),
  dueOn: text().nullable(),
  state: z.enum(["overdue", "due-today", "due-soon", "upcoming"]),
  daysLeft: z.number().nullable(),
  source: text(),
  storeId: z.uuid().nullable(),
  storeName: text().nullable(),
  systemId: z.uuid().nullable(),
  systemName: text().nullable(),
  findingId: z.uuid().nullable(),
  detectorId: z.uuid().nullable(),
  /** The client path of the records beneath this figure. */
  link: text(),
});
export type DueItem = z.infer<typeof dueItem>;

export const systemRecords = z.object({
  system,
  store: z.object({ id: z.uuid(), name: text(), timeZone: text() }),
  today: text(),
  profile: z.object({
    id: text(),
    name: text(),
    method: z.enum(["annualizing", "rolling-average"]),
    retentionYears: z.number(),
    retentionSource: text(),
    /** Whose words and articles the records use: US EPA leak repair, or EU F-gas leak checks. */
    wording: z.enum(["us", "eu"]),
    /** The profile sets leak-rate thresholds (the US parts); the EU regulation sets leak-check intervals instead. */
    leakRateRules: z.boolean(),
  }),
  /** The part's automatic-leak-detection requirement for this system (US Part 84), or null. */
  automaticLeakDetection: z
    .object({ required: z.boolean(), dueOn: text().nullable(), reason: text(), source: text() })
    .nullable(),
  /** How long the records are kept; `keptUntil` is set once the system is retired. */
  retention: z.object({ years: z.number(), source: text(), keptUntil: text().nullable() }),
  applicability: z.object({
    applies: z.boolean(),
    partId: text().nullable(),
    partTitle: text().nullable(),
    reason: text(),
    thresholdPercent: z.number().nullable(),
    thresholdSource: text().nullable(),
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
      reportDue: text().nullable(),
      /** Added while no leak-repair part applied to the system: listed, never counted. */
      notCountedKg: z.number(),
      /** Why the year is not judged when no part applied in it (the rule's reason), else null. */
      noPart: text().nullable(),
      /** The report marked filed: the day (store calendar), who signed for it, the authority's reference. */
      filed: z.object({ on: text(), by: text(), reference: text(), note: text(), recordedAt: text() }).nullable(),
    }),
  ),
  /** What was done to these records beyond the entries themselves (filed reports), newest first. */
  audit: z.array(z.object({ at: text(), by: text(), action: text(), summary: text() })),
  /** The chronic-leaker rule of the part in force, from the profile data (null when none applies). */
  chronicRule: z.object({ percent: z.number(), reportBy: text(), source: text() }).nullable(),
  co2e: z.object({ known: z.boolean(), tonnes: z.number().nullable(), gwp: z.number().nullable(), source: text() }),
  leakCheck: z
    .object({
      withLdsMonths: z.number().nullable(),
      withoutLdsMonths: z.number().nullable(),
      appliedMonths: z.number().nullable(),
      ldsRequired: z.boolean(),
      reason: text(),
    })
    .nullable(),
  nextInspection: z.object({ dueOn: text(), reason: text(), source: text() }).nullable(),
  due: z.array(dueItem),
  additions: z.array(chargeAddition),
  leakChecks: z.array(z.object({ id: z.uuid(), checkedOn: text(), leakFound: z.boolean(), note: text(), by: text() })),
  /** Checks of the leak detection system itself, oldest first. */
  leakDetectionChecks: z.array(
    z.object({ id: z.uuid(), checkedOn: text(), working: z.boolean(), note: text(), by: text() }),
  ),
  /** The leak detection system's own check is owed (EU, where one is mandatory): the form is offered. */
  leakDetectionCheckOwed: z.boolean(),
  cautions: z.array(caution),
});
export type SystemRecordsView = z.infer<typeof systemRecords>;

export const chargeAdditionResponse = z.object({ addition: chargeAddition, records: systemRecords });

export const todayResponse = z.object({
  generatedAt: text(),
  /** Whose words: "eu" has no leak-rate thresholds (EU F-gas sets leak-check intervals instead). */
  wording: z.enum(["us", "eu"]).default("us"),
  stores: z.array(z.object({ id: z.uuid(), name: text(), timeZone: text(), today: text() })),
  due: z.array(dueItem),
  overThreshold: z.array(
    z.object({
      systemId: z.uuid(),
      systemName: text(),
      storeId: z.uuid(),
      storeName: text(),
      refrigerantId: text(),
      /** What a reader sees: the R-number, or the company's name for its own refrigerant. */
      refrigerantName: text(),
      percent: z.number(),
      thresholdPercent: z.number(),
      on: text(),
      partTitle: text(),
      source: text(),
      link: text(),
    }),
  ),
  /** Every system of the stores shown, with its latest figure: the way into each system's records. */
  systems: z.array(
    z.object({
      id: z.uuid(),
      name: text(),
      storeId: z.uuid(),
      storeName: text(),
      refrigerantId: text(),
      /** What a reader sees: the R-number, or the company's name for its own refrigerant. */
      refrigerantName: text(),
      latestPercent: z.number().nullable(),
      latestOn: text().nullable(),
      thresholdPercent: z.number().nullable(),
      breachOpen: z.boolean(),
      /** The latest rate is above the threshold but a repair was recorded since (no action due for it). */
      repairedSince: z.boolean().default(false),
      nextInspection: text().nullable(),
      link: text(),
    }),
  ),
  openFindings: z.array(
    z.object({
      id: z.uuid(),
      storeId: z.uuid(),
      storeName: text(),
      systemId: z.uuid().nullable(),
      systemName: text().nullable(),
      status: text(),
      component: text().nullable(),
      foundOn: text(),
      deadline: text().nullable(),
      deadlineSource: text().nullable(),
      /** The day its system left service: nothing more is owed and it waits to be closed (docs/decisions/0166). */
      systemRetiredOn: text().nullable().optional(),
      link: text(),
    }),
  ),
});
export type TodayView = z.infer<typeof todayResponse>;

export const digestSendResult = z.object({
  sent: z.boolean(),
  localDate: text(),
  recipients: z.array(text()),
  itemCount: z.number(),
  message: text(),
});

/** GET /api/compliance/readings: how the company's profile reads rules not confirmed in their text. */
export const readingsResponse = z.object({
  profileId: text(),
  profileName: text(),
  readings: z.array(
    z.object({
      text: text(),
      kind: z.enum(["profile-value", "product-reading"]),
      decision: text().optional(),
      /** The owner's acceptance of these very words under this profile, or null while none (or withdrawn). */
      accepted: z.object({ by: text(), at: text(), note: text() }).nullable(),
      /** Every acceptance and withdrawal of these words under this profile, oldest first (never deleted). */
      history: z.array(z.object({ kind: z.enum(["accepted", "withdrawn"]), by: text(), at: text(), note: text() })),
    }),
  ),
});
export type ReadingsResponse = z.infer<typeof readingsResponse>;

/** POST /api/compliance/readings/accept: an owner accepts one listed reading as it is worded. */
export const acceptReadingInput = z.object({
  text: text({ error: "must be text" }).trim().min(1, "is required").max(2000, "must be at most 2,000 characters"),
  note: text({ error: "must be text" }).trim().max(500, "must be at most 500 characters").default(""),
});
export type AcceptReadingInput = z.infer<typeof acceptReadingInput>;

/** POST /api/compliance/readings/withdraw: an owner withdraws the acceptance of a listed reading, saying why. */
export const withdrawReadingInput = z.object({
  text: text({ error: "must be text" }).trim().min(1, "is required").max(2000, "must be at most 2,000 characters"),
  reason: text({ error: "must be text" }).trim().min(1, "is required").max(500, "must be at most 500 characters"),
});
export type WithdrawReadingInput = z.infer<typeof withdrawReadingInput>;
