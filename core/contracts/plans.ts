import { z } from "zod";
import { text } from "./text";
import { bounded, IMAGE_COORD_MAX_PX, PLAN_MAX_SIDE_M } from "./quantities";
import { idSchema } from "./common";
import { FixtureSchema, PlanPointSchema } from "./fixtures";

const pixels = bounded("pixels", -IMAGE_COORD_MAX_PX, IMAGE_COORD_MAX_PX);
export const imagePointSchema = z.object({ x: pixels, y: pixels });
export const lengthUnitSchema = z.enum(["m", "ft"], { error: "must be m or ft" });

export const revisionSchema = z
  .number({ error: "must be the layoutRevision the edit started from" })
  .int("must be a whole number")
  .min(0, "must be 0 or more");

/** Largest blank plan side (core/contracts/quantities.ts). */
export const BLANK_PLAN_MAX_M = PLAN_MAX_SIDE_M;

/** A plan length in either unit; its upper bound is checked in metres by `sideTooLong`. */
const FOOT_M = 0.3048; // exact (NIST SP 811)
const sideMessage = `must be at most ${PLAN_MAX_SIDE_M} m (${Math.floor(PLAN_MAX_SIDE_M / FOOT_M)} ft); is the unit right?`;
const planLength = z
  .number("must be a number of metres or feet")
  .finite("must be a finite number of metres or feet")
  .gt(0, "must be more than 0")
  .max(PLAN_MAX_SIDE_M / FOOT_M, sideMessage);
const sideTooLong = (value: number, unit: "m" | "ft") => value * (unit === "ft" ? FOOT_M : 1) > PLAN_MAX_SIDE_M;

export const blankPlanInput = z
  .object({ width: planLength, depth: planLength, unit: lengthUnitSchema.default("m") })
  .superRefine((v, ctx) => {
    for (const side of ["width", "depth"] as const)
      if (sideTooLong(v[side], v.unit)) ctx.addIssue({ code: "custom", path: [side], message: sideMessage });
  });
export type BlankPlanInput = z.infer<typeof blankPlanInput>;

export const calibrationInput = z.object({
  a: imagePointSchema,
  b: imagePointSchema,
  length: z.object({ value: planLength, unit: lengthUnitSchema }).superRefine((v, ctx) => {
    if (sideTooLong(v.value, v.unit)) ctx.addIssue({ code: "custom", path: ["value"], message: sideMessage });
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
      originalMime: text(),
      displayUrl: text(),
      thumbUrl: text(),
      originalUrl: text(),
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
  createdAt: text(),
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
