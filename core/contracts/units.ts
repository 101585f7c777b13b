import { z } from "zod";

export const LENGTH_UNITS = ["m", "ft-in"] as const;
export const MASS_UNITS = ["kg", "lb"] as const;
export const lengthUnitSchema = z.enum(LENGTH_UNITS);
export const massUnitSchema = z.enum(MASS_UNITS);
export type LengthUnit = z.infer<typeof lengthUnitSchema>;
export type MassUnit = z.infer<typeof massUnitSchema>;
