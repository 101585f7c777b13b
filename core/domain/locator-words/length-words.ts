import type { LengthPreference } from "../units/format-units";
import { toFeetInches } from "../units/length";
import { formatGrouped, type NumberFormat } from "../numbers/number-format";

/**
 * A distance in a sentence: metres to one decimal ("1.2 m"), or feet and whole inches ("3 ft 11 in",
 * "8 in", "2 ft"); a spot's position is an estimate, so finer figures would claim too much.
 */
export function lengthWords(metres: number, unit: LengthPreference, style: NumberFormat = "1,234.5"): string {
  if (unit === "m") return `${formatGrouped(metres, style, 1)} m`;
  const p = toFeetInches(metres, 1);
  const sign = p.negative ? "-" : "";
  if (p.feet === 0) return `${sign}${p.inches} in`;
  return p.inches === 0
    ? `${sign}${formatGrouped(p.feet, style, 0)} ft`
    : `${sign}${formatGrouped(p.feet, style, 0)} ft ${p.inches} in`;
}

/** A span of advice such as a tap spacing: "1.2–1.5 m" or, in whole feet, "4–5 ft". */
export function lengthRangeWords(
  lowM: number,
  highM: number,
  unit: LengthPreference,
  style: NumberFormat = "1,234.5",
): string {
  if (unit === "m") return `${formatGrouped(lowM, style, 1)}–${formatGrouped(highM, style, 1)} m`;
  const ft = (m: number) => Math.max(1, Math.round(m / 0.3048));
  return `${ft(lowM)}–${ft(highM)} ft`;
}
