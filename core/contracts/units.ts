import { z } from "zod";
import { NUMBER_FORMATS } from "../domain/numbers/number-format";

export const LENGTH_UNITS = ["m", "ft-in"] as const;
export const MASS_UNITS = ["kg", "lb"] as const;
export const lengthUnitSchema = z.enum(LENGTH_UNITS);
export const massUnitSchema = z.enum(MASS_UNITS);
export type LengthUnit = z.infer<typeof lengthUnitSchema>;
export type MassUnit = z.infer<typeof massUnitSchema>;

/** How the company writes numbers (core/domain/numbers/number-format.ts): grouping and decimal marks. */
export const numberFormatSchema = z.enum(NUMBER_FORMATS, {
  error: `must be one of ${NUMBER_FORMATS.map((f) => `"${f}"`).join(", ")}`,
});
