import { DomainInputError, requireFinite } from "../input-error";

/** Exact by definition: 1 lb (avoirdupois) = 0.45359237 kg (NIST SP 811, appendix B.8). */
export const KG_PER_POUND = 0.45359237;
/** 16 avoirdupois ounces to the pound (NIST SP 811, appendix B.8: 1 oz = 28.349523125 g). */
export const OUNCES_PER_POUND = 16;

export function poundsToKg(pounds: number): number {
  return requireFinite(pounds, "pounds") * KG_PER_POUND;
}

export function kgToPounds(kg: number): number {
  return requireFinite(kg, "kg") / KG_PER_POUND;
}

export type MassInputUnit = "kg" | "lb";

const NUMBER = String.raw`\d+(?:\.\d+)?|\.\d+`;
const METRIC = new RegExp(String.raw`^(${NUMBER})\s*(kg|g)$`);
const IMPERIAL = new RegExp(String.raw`^(?:(${NUMBER})\s*(?:lb|lbs|#)\s*)?(?:(${NUMBER})\s*oz)?$`);
const BARE = new RegExp(String.raw`^(${NUMBER})$`);

/**
 * Parses a typed mass into kg: `12.5 kg`, `1250 g`, `27.5 lb`, `27 lb 8 oz`, `8 oz`, or a bare
 * number in `defaultUnit`. Refrigerant is weighed in lb and oz on US scales, hence the pair.
 */
export function parseMass(text: string, defaultUnit: MassInputUnit, field = "mass"): number {
  if (typeof text !== "string" || text.trim() === "") throw new DomainInputError(field, "is empty");
  const t = text
    .trim()
    .toLowerCase()
    .replace(/\s+/g, " ")
    .replace(/\b(?:pounds|pound)\b/g, "lb")
    .replace(/\b(?:ounces|ounce)\b/g, "oz")
    .replace(/\b(?:kilograms|kilogram|kilos)\b/g, "kg")
    .replace(/\b(?:grams|gram)\b/g, "g");
  if (t.startsWith("-")) throw new DomainInputError(field, "must not be negative");
  if (t.includes(",")) throw new DomainInputError(field, `use a decimal point, not a comma: "${text}"`);
  const bare = BARE.exec(t);
  if (bare) return defaultUnit === "kg" ? Number(bare[1]) : Number(bare[1]) * KG_PER_POUND;
  const metric = METRIC.exec(t);
  if (metric) return Number(metric[1]) * (metric[2] === "kg" ? 1 : 0.001);
  const imperial = IMPERIAL.exec(t);
  if (imperial && (imperial[1] !== undefined || imperial[2] !== undefined)) {
    const pounds = imperial[1] !== undefined ? Number(imperial[1]) : 0;
    const ounces = imperial[2] !== undefined ? Number(imperial[2]) : 0;
    if (imperial[1] !== undefined && ounces >= OUNCES_PER_POUND) {
      throw new DomainInputError(field, `ounces after pounds must be under 16, got ${ounces}`);
    }
    return (pounds + ounces / OUNCES_PER_POUND) * KG_PER_POUND;
  }
  throw new DomainInputError(field, `could not read "${text}" as a mass (try 12.5 kg or 27 lb 8 oz)`);
}
