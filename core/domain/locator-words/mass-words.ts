import { KG_PER_POUND, OUNCES_PER_POUND } from "../units/mass";
import type { MassPreference } from "../units/format-units";
import { formatSignificant, type NumberFormat } from "../numbers/number-format";

const GRAMS_PER_POUND = KG_PER_POUND * 1000;

/**
 * An emission per year to two significant figures, in the reader's mass unit: g/yr below 1 kg and kg/yr
 * above it, or oz/yr below 1 lb and lb/yr above it (a figure that would round up to 1,000 g or 16 oz moves up a unit) (1 lb = 453.59237 g, 16 oz; NIST SP 811, B.8).
 */
export function massPerYearWords(grams: number, unit: MassPreference, style: NumberFormat = "1,234.5"): string {
  if (unit === "kg") {
    return grams < 995
      ? `${formatSignificant(grams, 2, style)} g/yr`
      : `${formatSignificant(grams / 1000, 2, style)} kg/yr`;
  }
  const pounds = grams / GRAMS_PER_POUND;
  return pounds * OUNCES_PER_POUND < 15.5
    ? `${formatSignificant(pounds * OUNCES_PER_POUND, 2, style)} oz/yr`
    : `${formatSignificant(pounds, 2, style)} lb/yr`;
}
