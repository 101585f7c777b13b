import { z } from "zod";
import { text } from "./text";

/**
 * The shape of a rule profile on the wire (a company's custom profile, edited in Company settings).
 * Every value carries its source: a citation, or who set it and why ("company policy, 2026 audit").
 * The server also runs the domain check (core/domain/compliance/custom-profile.ts) before storing.
 */

const APPLIANCES = ["commercial-refrigeration", "industrial-process", "comfort-cooling"] as const;
const BASES = ["AR4", "AR5", "AR6", "EU-517/2014"] as const;

const source = text({ error: "is required (a citation, or who set the value and why)" })
  .trim()
  .min(1, "is required (a citation, or who set the value and why)")
  .max(500, "must be at most 500 characters");

const sourced = <T extends z.ZodType>(value: T) =>
  z.object({ value, source, note: text().max(500, "must be at most 500 characters").optional() });

// No figure in a rule profile comes near ten million (the largest are charge limits in lb and t CO2e).
const PROFILE_FIGURE_MAX = 10_000_000;
const num = (what: string) =>
  z
    .number({ error: `must be a number (${what})` })
    .refine(Number.isFinite, `must be a finite number (${what})`)
    .refine(
      (v) => Math.abs(v) <= PROFILE_FIGURE_MAX,
      `must be at most ${PROFILE_FIGURE_MAX.toLocaleString("en-US")} (${what})`,
    );
const positive = (what: string, max: number) =>
  num(what).gt(0, `must be above 0 (${what})`).max(max, `must be at most ${max} (${what})`);
const wholeDays = (min: number) =>
  z
    .int(`must be a whole number of days`)
    .min(min, min === 0 ? "must be 0 or more days" : `must be at least ${min} day`)
    .max(3650, "must be at most 3,650 days");
const wholeMonths = z
  .int("must be a whole number of months")
  .min(1, "must be at least 1 month")
  .max(120, "must be at most 120 months");

const isoDay = z
  .string({ error: "must be a date as YYYY-MM-DD" })
  .regex(/^\d{4}-\d{2}-\d{2}$/, "must be a date as YYYY-MM-DD");
const massLimit = z.object({
  value: num("mass").min(0, "must be 0 or more"),
  unit: z.enum(["lb", "kg"], { error: "must be lb or kg" }),
});

export const massLimitSchema = massLimit;
export const leakCheckBandSchema = z.object({
  /** Lower edge, inclusive (t CO2e for Annex I gases, kg for HFOs). */
  from: num("lower edge").min(0, "must be 0 or more"),
  /** Exclusive upper edge; null for the open top band. */
  to: num("upper edge").nullable(),
  monthsWithoutLds: wholeMonths,
  monthsWithLds: wholeMonths,
  /** A leak detection system is mandatory in this band. */
  ldsRequired: z.boolean({ error: "must be true or false" }),
});

/** Bands must run upwards without gaps: each `to` above its `from`, equal to the next `from`, the top one open. */
const bands = z
  .array(leakCheckBandSchema)
  .min(1, "needs at least one band")
  .superRefine((list, ctx) => {
    list.forEach((b, i) => {
      const last = i === list.length - 1;
      if (b.to !== null && b.to <= b.from)
        ctx.addIssue({ code: "custom", path: [i, "to"], message: `must be above the band's lower edge (${b.from})` });
      if (!last && b.to === null)
        ctx.addIssue({ code: "custom", path: [i, "to"], message: "only the top band may be open" });
      if (!last && b.to !== null && b.to !== list[i + 1].from) {
        ctx.addIssue({
          code: "custom",
          path: [i + 1, "from"],
          message: `must equal the band below's upper edge (${b.to}), so bands ascend without gaps or overlaps`,
        });
      }
      if (last && b.to !== null)
        ctx.addIssue({ code: "custom", path: [i, "to"], message: "must be empty (open) for the top band" });
      if (b.monthsWithLds < b.monthsWithoutLds)
        ctx.addIssue({
          code: "custom",
          path: [i, "monthsWithLds"],
          message: "must be at least the interval without a leak detection system",
        });
    });
  });

export const leakRatePartSchema = z.object({
  id: text().trim().min(1, "is required"),
  title: text().trim().min(1, "is required").max(200, "must be at most 200 characters"),
  /** Which refrigerants it covers: ozone-depleting ones, or non-ODS with GWP above a value. */
  covers: sourced(
    z.union([
      z.object({ ozoneDepleting: z.literal(true) }),
      z.object({ ozoneDepleting: z.literal(false), gwpAbove: num("GWP").min(0, "must be 0 or more") }),
    ]),
  ),
  /** Applies from this full charge (inclusive: "≥ 50 lb"). */
  minFullCharge: sourced(massLimit),
  /** Applies to calculations on or after this date (inclusive). */
  effectiveFrom: sourced(text().regex(/^\d{4}-\d{2}-\d{2}$/, "must be a date as YYYY-MM-DD")).optional(),
  /** Leak-rate thresholds in % per year; a rate *above* the threshold is a breach. */
  thresholds: z.object({
    "commercial-refrigeration": sourced(positive("% per year", 1000)),
    "industrial-process": sourced(positive("% per year", 1000)),
    "comfort-cooling": sourced(positive("% per year", 1000)),
  }),
  /** Repair within this many days of learning of the breach. */
  repairDays: sourced(wholeDays(1)),
  /** Initial verification test within this many days of the repair (0: the day of the repair). */
  initialVerificationDays: sourced(wholeDays(0)),
  /** Follow-up verification test within this many days of the initial test. */
  followUpVerificationDays: sourced(wholeDays(1)),
  /** Annualizing method: days used when no earlier addition exists. */
  firstCalculationDays: sourced(wholeDays(1)),
  /** Cap on the days since the last addition ("the shorter of … or 365 days"). */
  maxDaysSinceLastAddition: sourced(wholeDays(1)),
  /** Rolling average: window in days, shortened by a successful follow-up verification. */
  rollingWindowDays: sourced(wholeDays(1)),
  /**
   * Periodic leak inspections after a breach, until the rate stays below the threshold: systems of
   * `largeTypes` from `largeFromCharge` every `largeEveryMonths` until `largeUntilPeriodsBelow`
   * periods are below; others likewise; waived while calibrated automatic leak detection watches.
   */
  inspectionsAfterBreach: sourced(
    z.object({
      largeTypes: z.array(z.enum(APPLIANCES)),
      largeFromCharge: massLimit,
      largeEveryMonths: wholeMonths,
      largeUntilPeriodsBelow: z
        .int("must be a whole number")
        .min(1, "must be at least 1")
        .max(120, "must be at most 120"),
      otherEveryMonths: wholeMonths,
      otherUntilPeriodsBelow: z
        .int("must be a whole number")
        .min(1, "must be at least 1")
        .max(120, "must be at most 120"),
      waivedWithAutomaticLeakDetection: z.boolean({ error: "must be true or false" }),
    }),
  ).optional(),
  /**
   * Automatic leak detection required for these types from this full charge; installed within
   * `withinDays` of the in-service day or by a fixed date `by`, by in-service range.
   */
  automaticLeakDetectionRequired: sourced(
    z.object({
      types: z.array(z.enum(APPLIANCES)),
      fromCharge: massLimit,
      installDeadlines: z
        .array(
          z.object({
            inServiceFrom: isoDay,
            inServiceBefore: isoDay.optional(),
            withinDays: wholeDays(0).optional(),
            by: isoDay.optional(),
          }),
        )
        .max(10, "must list at most 10 deadlines")
        .optional(),
    }),
  ).optional(),
  /** When a repair does not hold: a retrofit-or-retire plan within `planDays`, carried out within `carryOutMonths`. */
  failedRepair: sourced(z.object({ planDays: wholeDays(1), carryOutMonths: wholeMonths })).optional(),
  /** Added in one calendar year as % of full charge (reaching it flags the system); report by month/day of the next year. */
  chronicLeaker: z.object({
    percentOfFullCharge: sourced(positive("% of the full charge", 10000)),
    reportBy: sourced(
      z.object({
        month: z.int("must be a whole month").min(1, "must be 1 to 12").max(12, "must be 1 to 12"),
        day: z.int("must be a whole day").min(1, "must be 1 to 31").max(31, "must be 1 to 31"),
      }),
    ),
  }),
});

/**
 * Any rule profile, built-in or custom: the one description of its shape. The domain's types
 * (core/domain/compliance/rule-profile.ts) are inferred from it, and a custom profile is this
 * shape with its id and kind fixed (`ruleProfileSchema` below).
 */
export const anyRuleProfileSchema = z.object({
  id: text().trim().min(1, "is required"),
  name: text({ error: "is required" }).trim().min(1, "is required").max(120, "must be at most 120 characters"),
  kind: z.enum(["us-federal", "eu-fgas", "custom"], { error: "must be us-federal, eu-fgas or custom" }),
  /** For a custom profile: the id of the profile it was copied from. */
  basedOn: z.enum(["us-federal", "eu-fgas"], { error: "must be us-federal or eu-fgas" }).optional(),
  gwpBases: sourced(z.array(z.enum(BASES)).min(1, "list at least one GWP basis")),
  leakRateParts: z.array(leakRatePartSchema),
  leakChecks: z
    .object({
      co2eBands: sourced(bands),
      hfoBands: sourced(bands),
      hermeticExemptBelowTonnes: sourced(num("t CO2e").min(0, "must be 0 or more")),
      recheckAfterRepairMonths: sourced(wholeMonths),
      /**
       * How often a leak detection system must itself be checked where one is mandatory. Optional:
       * custom profiles saved before it existed read as 12 months (docs/decisions/0123).
       */
      ldsCheckMonths: sourced(wholeMonths).optional(),
    })
    .optional(),
  recordRetentionYears: sourced(
    z.int("must be a whole number of years").min(1, "must be at least 1 year").max(100, "must be at most 100 years"),
  ),
});

/** A company's custom profile on the wire (PUT /api/company/custom-profile). */
export const ruleProfileSchema = anyRuleProfileSchema.extend({
  id: z.literal("custom", { error: "must be custom" }),
  kind: z.literal("custom", { error: "must be custom" }),
  basedOn: z.enum(["us-federal", "eu-fgas"], { error: "must be us-federal or eu-fgas" }),
});
export type RuleProfileInput = z.infer<typeof ruleProfileSchema>;

export const startCustomProfileInput = z.object({
  from: z.enum(["us-federal", "eu-fgas"], { error: "must be us-federal or eu-fgas" }),
});

export const customProfileView = z.object({
  profile: ruleProfileSchema.nullable(),
  savedAt: text().nullable(),
  savedBy: text().nullable(),
  /** Whether the company's rule-profile setting is "custom" (the profile is in force). */
  inForce: z.boolean(),
});
export type CustomProfileView = z.infer<typeof customProfileView>;

/**
 * The values of a rule profile in words, keyed by their path in `anyRuleProfileSchema` (a leak-rate
 * part's fields without the `leakRateParts.N.` prefix): the one table the custom-profile form takes
 * its labels and hints from. A test checks every key is a path of the built-in profiles.
 */
export const RULE_PROFILE_FIELDS = {
  recordRetentionYears: { label: "Keep records (years)" },
  "thresholds.commercial-refrigeration": { label: "Commercial refrigeration" },
  "thresholds.industrial-process": { label: "Industrial process refrigeration" },
  "thresholds.comfort-cooling": { label: "Comfort cooling" },
  repairDays: { label: "Repair within (days)", hint: "From the day the leak rate above the threshold is learned." },
  initialVerificationDays: {
    label: "Initial verification test (days after the repair)",
    hint: "0: on the day of the repair.",
  },
  followUpVerificationDays: { label: "Follow-up verification test (days after the initial test)" },
  "inspectionsAfterBreach.value.largeEveryMonths": { label: "Large systems: every (months)" },
  "inspectionsAfterBreach.value.otherEveryMonths": { label: "Other systems: every (months)" },
  "inspectionsAfterBreach.source": { label: "Source for the inspection intervals" },
  "chronicLeaker.percentOfFullCharge": { label: "Added in a calendar year (% of full charge)" },
  "chronicLeaker.reportBy.value.month": { label: "Report by: month" },
  "chronicLeaker.reportBy.value.day": { label: "Report by: day" },
  "chronicLeaker.reportBy.source": { label: "Source for the report date" },
  "leakChecks.co2eBands.source": { label: "Source for the CO2e bands" },
  "leakChecks.recheckAfterRepairMonths": { label: "Re-check after a repair (months)" },
  "leakChecks.ldsCheckMonths": {
    label: "Check of a mandatory leak detection system (every … months)",
    hint: "Where the band requires a leak detection system, the system itself is checked this often.",
  },
} as const satisfies Record<string, { label: string; hint?: string }>;
