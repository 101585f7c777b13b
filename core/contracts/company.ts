import { z } from "zod";
import { text } from "./text";
import { lengthUnitSchema, massUnitSchema, numberFormatSchema } from "./units";
import { PAPER_SETTINGS } from "../domain/reports/paper";

export const RULE_PROFILES = ["us-federal", "eu-fgas", "custom"] as const;
export const LEAK_RATE_METHODS = ["annualizing", "rolling-average"] as const;

export const companySettings = z.object({
  name: text().trim().min(1, "is required").max(120, "must be at most 120 characters"),
  lengthUnit: lengthUnitSchema,
  massUnit: massUnitSchema,
  numberFormat: numberFormatSchema,
  ruleProfile: z.enum(RULE_PROFILES),
  leakRateMethod: z.enum(LEAK_RATE_METHODS),
  detectorCheckIntervalDays: z
    .int("must be a whole number of days")
    .min(1, "must be at least 1 day")
    .max(730, "must be at most 730 days"),
  /** Paper of every PDF; "profile" follows the rule profile. Left as saved when a request omits it. */
  paperSize: z.enum(PAPER_SETTINGS, "must be profile, letter or a4").optional(),
});
export type CompanySettings = z.infer<typeof companySettings>;
/** PUT /api/company/settings: the number format may be left out (kept as it is) by clients older than it. */
export const companySettingsInput = companySettings.partial({ numberFormat: true });
