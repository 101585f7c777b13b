import { z } from "zod";
import { idSchema } from "./common";
import { FixtureSchema, PlanPointSchema } from "./fixtures";

const finite = (what: string) =>
  z
    .number({ error: `must be a finite number of ${what}` })
    .refine(Number.isFinite, { message: `must be a finite number of ${what}` });

export const imagePointSchema = z.object({ x: finite("pixels"), y: finite("pixels") });
export const lengthUnitSchema = z.enum(["m", "ft"], { error: "must be m or ft" });

export const revisionSchema = z
  .number({ error: "must be the layoutRevision the edit started from" })
  .int("must be a whole number")
  .min(0, "must be 0 or more");

/** Largest blank plan side: a big hypermarket is a few hundred metres; this catches unit slips. */
export const BLANK_PLAN_MAX_M = 2000;

export const blankPlanInput = z.object({
  width: finite("metres or feet").refine((v) => v > 0, { message: "must be more than 0" }),
  depth: finite("metres or feet").refine((v) => v > 0, { message: "must be more than 0" }),
  unit: lengthUnitSchema.default("m"),
});
export type BlankPlanInput = z.infer<typeof blankPlanInput>;

export const calibrationInput = z.object({
  a: imagePointSchema,
  b: imagePointSchema,
  length: z.object({
    value: finite("metres or feet").refine((v) => v > 0, { message: "must be more than 0" }),
    unit: lengthUnitSchema,
  }),
  /** Optional guard: when given, a stale revision is a conflict (calibration may rescale fixtures). */
  layoutRevision: revisionSchema.optional(),
});
export type CalibrationInput = z.infer<typeof calibrationInput>;

export const alignmentInput = z.object({
  /** Two points in the previous version's plan metres … */
  previous: z.tuple([PlanPointSchema, PlanPointSchema], { error: "must be two points {x, y} in metres" }),
  /** … and where they are on this version, in this version's plan metres. */
  current: z.tuple([PlanPointSchema, PlanPointSchema], { error: "must be two points {x, y} in metres" }),
  /** Move this version's fixtures by the change of alignment (default true: copies land on the new drawing). */
  moveFixtures: z.boolean({ error: "must be true or false" }).default(true),
  layoutRevision: revisionSchema,
});
export type AlignmentInput = z.infer<typeof alignmentInput>;

/** The list is checked against the plan's bounds in the service with the shared fixture schema. */
export const fixturesPutInput = z.object({
  layoutRevision: revisionSchema,
  fixtures: z.array(z.unknown(), { error: "must be a list of fixtures" }),
});
export type FixturesPutInput = z.infer<typeof fixturesPutInput>;

export const imageVariantSchema = z.enum(["display", "thumb", "original"], {
  error: "must be display, thumb or original",
});
export type ImageVariant = z.infer<typeof imageVariantSchema>;

export const similaritySchema = z.object({ scale: z.number(), rotation: z.number(), tx: z.number(), ty: z.number() });

export const plan = z.object({
  id: idSchema,
  storeId: idSchema,
  version: z.number(),
  source: z.enum(["image", "blank"]),
  image: z
    .object({
      widthPx: z.number(),
      heightPx: z.number(),
      originalWidthPx: z.number(),
      originalHeightPx: z.number(),
      originalMime: z.string(),
      displayUrl: z.string(),
      thumbUrl: z.string(),
      originalUrl: z.string(),
    })
    .nullable(),
  metresPerPixel: z.number().nullable(),
  calibration: z
    .object({
      a: imagePointSchema,
      b: imagePointSchema,
      length: z.object({ value: z.number(), unit: lengthUnitSchema }),
    })
    .nullable(),
  /** True once fixtures may be saved: an image plan after calibration, a blank plan always. */
  calibrated: z.boolean(),
  widthM: z.number().nullable(),
  heightM: z.number().nullable(),
  previousPlanId: idSchema.nullable(),
  alignment: similaritySchema.nullable(),
  alignmentMatched: z.boolean(),
  layoutRevision: z.number(),
  fixtureCount: z.number(),
  createdAt: z.string(),
});
export type Plan = z.infer<typeof plan>;

export const planVersionSummary = plan.pick({
  id: true,
  version: true,
  source: true,
  calibrated: true,
  fixtureCount: true,
  createdAt: true,
});

export const fixturesResponse = z.object({
  planId: idSchema,
  layoutRevision: z.number(),
  bounds: z.object({ width: z.number(), height: z.number() }).nullable(),
  fixtures: z.array(FixtureSchema),
});
export type FixturesResponse = z.infer<typeof fixturesResponse>;

export const calibrationResponse = z.object({
  plan,
  /** "first" (no scale before), "rescaled" (fixtures moved in place) or "new-version" (sweeps exist). */
  outcome: z.enum(["first", "rescaled", "new-version"]),
});
