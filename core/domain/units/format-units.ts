import { formatGrouped, type NumberFormat } from "../numbers/number-format";
import { formatFixed } from "../numbers/round-half-up";
import { formatFeetInches, type InchDenominator } from "./length";
import { kgToPounds } from "./mass";

/** Length preference: metres, or feet and inches (the same ids as core/contracts/units.ts). Stored in metres. */
export type LengthPreference = "m" | "ft-in";
/** Mass preference. Everything is stored in kg. */
export type MassPreference = "kg" | "lb";

export interface LengthFormatOptions {
  /** Decimal places for metres (default 2, i.e. centimetres). */
  decimals?: number;
  /** Inch fraction for feet and inches (default 1/2 inch). */
  denominator?: InchDenominator;
}

/** `3.25 m` or `10 ft 8 in`, following the user's preference. */
export function formatLength(metres: number, preference: LengthPreference, options: LengthFormatOptions = {}): string {
  if (preference === "ft-in") return formatFeetInches(metres, options.denominator ?? 2);
  return `${formatFixed(metres, options.decimals ?? 2)} m`;
}

/** `12.50 kg` or `27.56 lb`, following the user's preference (2 decimals unless told). */
export function formatMass(kg: number, preference: MassPreference, decimals = 2): string {
  return preference === "lb" ? `${formatFixed(kgToPounds(kg), decimals)} lb` : `${formatFixed(kg, decimals)} kg`;
}

/**
 * A mass as the records write it: both units, the company's first, grouped in its number format
 * (`4.54 kg (10.0 lb)`, `1.500,0 lb (680,39 kg)`), so a record reads the same whichever unit a later
 * reader prefers.
 */
export function formatRecordMass(kg: number, first: MassPreference, format: NumberFormat = "1,234.5"): string {
  const metric = `${formatGrouped(kg, format, 2)} kg`;
  const pounds = `${formatGrouped(kgToPounds(kg), format, 1)} lb`;
  return first === "lb" ? `${pounds} (${metric})` : `${metric} (${pounds})`;
}
