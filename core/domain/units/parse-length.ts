import { DomainInputError } from "../input-error";
import { METRES_PER_FOOT, METRES_PER_INCH } from "./length";

export type LengthInputUnit = "m" | "ft";

const VULGAR: Record<string, string> = {
  "½": " 1/2",
  "¼": " 1/4",
  "¾": " 3/4",
  "⅛": " 1/8",
  "⅜": " 3/8",
  "⅝": " 5/8",
  "⅞": " 7/8",
};

const NUMBER = String.raw`\d+(?:\.\d+)?|\.\d+`;
const METRIC = new RegExp(String.raw`^(${NUMBER})\s*(mm|cm|m)$`);
const FEET = new RegExp(String.raw`^(${NUMBER})\s*(?:ft|')\s*`);
const INCHES = new RegExp(String.raw`^(?:(${NUMBER}))?\s*(?:(\d+)\s*/\s*(\d+))?\s*(in|")?$`);
const METRIC_FACTORS = { mm: 0.001, cm: 0.01, m: 1 } as const;

function normalise(text: string): string {
  let t = text.trim().toLowerCase();
  for (const [glyph, ascii] of Object.entries(VULGAR)) t = t.split(glyph).join(ascii);
  return t
    .replace(/[′’‘]/g, "'")
    .replace(/[″”“]|''/g, '"')
    .replace(/\b(?:feet|foot)\b/g, "ft")
    .replace(/\b(?:inches|inch)\b/g, "in")
    .replace(/\b(?:metres|meters|metre|meter)\b/g, "m")
    .replace(/\s+/g, " ")
    .trim();
}

/**
 * Parses a typed length into metres. Accepts `3.2 m`, `320 cm`, `12 ft 3 1/2 in`, `12' 3.5"`,
 * `12′ 3½″`, `147 in`, `3 1/2"`, and a bare number in `defaultUnit` (`12.5` or `12 1/2`).
 * Decimal commas are refused rather than guessed (is `1,500` one and a half or fifteen hundred?).
 */
export function parseLength(text: string, defaultUnit: LengthInputUnit, field = "length"): number {
  if (typeof text !== "string" || text.trim() === "") throw new DomainInputError(field, "is empty");
  const t = normalise(text);
  if (t.startsWith("-")) throw new DomainInputError(field, "must not be negative");
  if (t.includes(",")) throw new DomainInputError(field, `use a decimal point, not a comma: "${text}"`);

  const metric = METRIC.exec(t);
  if (metric) return Number(metric[1]) * METRIC_FACTORS[metric[2] as keyof typeof METRIC_FACTORS];

  let feet = 0;
  let rest = t;
  const feetMatch = FEET.exec(t);
  if (feetMatch) {
    feet = Number(feetMatch[1]);
    rest = t.slice(feetMatch[0].length);
  }
  const inchMatch = INCHES.exec(rest);
  const hasNumber = inchMatch && (inchMatch[1] !== undefined || inchMatch[2] !== undefined);
  if (!inchMatch || (!hasNumber && rest !== "")) {
    throw new DomainInputError(field, `could not read "${text}" as a length (try 3.2 m or 12 ft 3 1/2 in)`);
  }
  let amount = inchMatch[1] !== undefined ? Number(inchMatch[1]) : 0;
  if (inchMatch[2] !== undefined) {
    const num = Number(inchMatch[2]);
    const den = Number(inchMatch[3]);
    if (den === 0) throw new DomainInputError(field, `fraction ${num}/0 has a zero denominator`);
    if (inchMatch[1] !== undefined && inchMatch[1].includes(".")) {
      throw new DomainInputError(field, `mixes a decimal and a fraction: "${text}"`);
    }
    amount += num / den;
  }
  if (feetMatch) {
    // After a feet part, the remainder is inches whether or not it carries its mark.
    if (amount >= 12) throw new DomainInputError(field, `inches after feet must be under 12, got ${amount}`);
    return feet * METRES_PER_FOOT + amount * METRES_PER_INCH;
  }
  if (inchMatch[4]) return amount * METRES_PER_INCH;
  if (!hasNumber) throw new DomainInputError(field, `could not read "${text}" as a length`);
  return defaultUnit === "m" ? amount : amount * METRES_PER_FOOT;
}
