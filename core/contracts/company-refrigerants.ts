import { z } from "zod";
import { text } from "./text";
import { GWP_MAX } from "./quantities";
import { idSchema } from "./common";
import { refrigerantSummary } from "./systems";

export const SAFETY_CLASS_VALUES = ["A1", "A2L", "A2", "A3", "B1", "B2L", "B2", "B3"] as const;
export const SUBSTANCE_CLASS_VALUES = ["ods", "hfc", "hfo", "other"] as const;
export const GWP_BASIS_VALUES = ["AR4", "AR5", "AR6", "EU-517/2014"] as const;

/** The heaviest molecule among refrigerants is a few hundred g/mol (CFC-114 ≈ 171, from memory); 1,000 leaves room. */
export const MOLAR_MASS_MAX = 1000;

/** What the company calls it: letters, digits, spaces and - . / ( ) +, as blend names are written. */
const nameSchema = text({ error: "must be text" })
  .trim()
  .min(1, "is required")
  .max(40, "must be at most 40 characters")
  .regex(/^[\p{L}\p{N}][\p{L}\p{N} \-./()+]*$/u, "may hold letters, digits, spaces and - . / ( ) + only");

const massPercent = z
  .number({ error: "must be a number" })
  .refine(Number.isFinite, { message: "must be a finite number" })
  .refine((v) => v > 0, { message: "must be more than 0" })
  .refine((v) => v <= 100, { message: "must be at most 100" });

const component = z.object({
  refrigerantId: text({ error: "must be an R-number such as R-32" })
    .trim()
    .min(1, "is required")
    .max(40, "must be at most 40 characters"),
  massPercent,
});

const statedGwp = z.object({
  value: z
    .number({ error: "must be a number" })
    .refine(Number.isFinite, { message: "must be a finite number" })
    .refine((v) => v >= 0, { message: "must not be negative" })
    .refine((v) => v <= GWP_MAX, { message: `must be at most ${GWP_MAX.toLocaleString("en-US")}` }),
  basis: z.enum(GWP_BASIS_VALUES, { error: `must be one of: ${GWP_BASIS_VALUES.join(", ")}` }),
  /** Where the figure comes from: the maker's data sheet, a standard, a regulation's annex. */
  source: text({ error: "must be text" }).trim().min(1, "is required").max(300, "must be at most 300 characters"),
});

/**
 * POST /api/company-refrigerants: a refrigerant the catalogue lacks, either by composition (GWP
 * computed on each profile's basis) or by a stated GWP with its basis and source (docs/decisions/0073).
 */
export const companyRefrigerantInput = z
  .object({
    name: nameSchema,
    safetyClass: z.enum(SAFETY_CLASS_VALUES, { error: `must be one of: ${SAFETY_CLASS_VALUES.join(", ")}` }),
    substanceClass: z
      .enum(SUBSTANCE_CLASS_VALUES, { error: `must be one of: ${SUBSTANCE_CLASS_VALUES.join(", ")}` })
      .optional(),
    molarMass: z
      .number({ error: "must be a number" })
      .refine(Number.isFinite, { message: "must be a finite number" })
      .refine((v) => v > 1, { message: "must be more than 1 g/mol" })
      .refine((v) => v <= MOLAR_MASS_MAX, { message: `must be at most ${MOLAR_MASS_MAX} g/mol` })
      .nullable()
      .optional(),
    composition: z
      .array(component, { error: "must be a list of components" })
      .min(2, "needs at least two components (a single substance is in the catalogue)")
      .max(8, "must have at most 8 components")
      .optional(),
    statedGwp: statedGwp.optional(),
  })
  .refine((v) => v.composition !== undefined || v.statedGwp !== undefined, {
    message: "give a composition or a stated GWP",
    path: ["composition"],
  })
  .refine((v) => v.composition === undefined || v.statedGwp === undefined, {
    message: "give either a composition or a stated GWP, not both",
    path: ["statedGwp"],
  });
export type CompanyRefrigerantInput = z.infer<typeof companyRefrigerantInput>;

export const companyRefrigerantView = z.object({
  rowId: idSchema,
  summary: refrigerantSummary,
  safetyClass: z.enum(SAFETY_CLASS_VALUES),
  substanceClass: z.enum(SUBSTANCE_CLASS_VALUES),
  composition: z.array(z.object({ refrigerantId: text(), massPercent: z.number() })).nullable(),
  statedGwp: statedGwp.nullable(),
  molarMass: z.number().nullable(),
  /** Systems (in service or retired) whose records name it: such a refrigerant is retired, never deleted. */
  systemsUsing: z.number(),
  retired: z.boolean(),
  enteredBy: text(),
  enteredAt: text(),
});
export type CompanyRefrigerantView = z.infer<typeof companyRefrigerantView>;

export const companyRefrigerantList = z.object({ refrigerants: z.array(companyRefrigerantView) });

/** PATCH /api/company-refrigerants/:id: retire (hide from the picker) or bring back; nothing else changes once entered. */
export const companyRefrigerantRetiredInput = z.object({ retired: z.boolean({ error: "must be true or false" }) });
