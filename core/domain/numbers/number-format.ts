import { DomainInputError, requireFinite } from "../input-error";
import { formatFixed, roundHalfUp } from "./round-half-up";

/**
 * How a company writes numbers: thousands grouped by a comma with a decimal point ("1,234.5", as in
 * the US and UK), by a point with a decimal comma ("1.234,5", as in Germany), or by a space with a
 * decimal comma ("1 234,5", as in France; ISO 80000-1 §7.3.1 groups digits in threes with a space).
 * One parse and one format so the screens, CSVs and PDFs read and write alike.
 */
export const NUMBER_FORMATS = ["1,234.5", "1.234,5", "1 234,5"] as const;
export type NumberFormat = (typeof NUMBER_FORMATS)[number];

/** Where nothing says otherwise (the command line, a company made before the setting). */
export const DEFAULT_NUMBER_FORMAT: NumberFormat = "1,234.5";

/** The formats in words, for the sign-up and settings forms. */
export const NUMBER_FORMAT_NAMES: Readonly<Record<NumberFormat, string>> = {
  "1,234.5": "1,234.5 (comma groups, decimal point)",
  "1.234,5": "1.234,5 (point groups, decimal comma)",
  "1 234,5": "1 234,5 (space groups, decimal comma)",
};

interface Marks {
  group: string;
  decimal: string;
  /** Characters read as the group mark on input: a space format also takes the no-break spaces. */
  groupInput: readonly string[];
}

// U+00A0 no-break space and U+202F narrow no-break space: what Intl and word processors put between groups.
// Written, the space format groups every number from 1,000 up with U+202F, as CLDR's fr-FR does
// (Intl.NumberFormat; number-format.test.ts checks it), not ISO 80000-1's optional ungrouped
// four digits: one rule for screens, CSVs and PDFs, and the narrow space keeps a number on one line.
const MARKS: Record<NumberFormat, Marks> = {
  "1,234.5": { group: ",", decimal: ".", groupInput: [","] },
  "1.234,5": { group: ".", decimal: ",", groupInput: ["."] },
  "1 234,5": { group: "\u202f", decimal: ",", groupInput: [" ", "\u00a0", "\u202f"] },
};

export type ParsedNumber = { ok: true; value: number } | { ok: false; reason: string };

/**
 * Reads a number as the company writes it. Grouping is optional but, where present, must be in
 * threes ("1,200" and "1200" are twelve hundred in "1,234.5"; "12,00" is refused, not guessed).
 * In a decimal-comma format "1,200" is one point two. The other format's decimal mark is refused
 * with the reason, because guessing is how 1,200 lb becomes 1.2 lb on a record.
 */
export function parseGroupedNumber(text: string, format: NumberFormat): ParsedNumber {
  const m = MARKS[format];
  let t = typeof text === "string" ? text.trim() : "";
  if (t === "") return { ok: false, reason: "is empty" };
  let sign = 1;
  if (t.startsWith("-") || t.startsWith("\u2212")) {
    sign = -1;
    t = t.slice(1).trimStart();
  }
  const allowed = new Set(["0", "1", "2", "3", "4", "5", "6", "7", "8", "9", ".", ",", ...m.groupInput]);
  if ([...t].some((c) => !allowed.has(c))) return { ok: false, reason: `is not a number in the format ${format}` };
  // Every group mark becomes NUL, which the check above keeps out of the typed text.
  for (const g of m.groupInput) t = t.split(g).join("\u0000");
  const [whole, fraction, extra] = t.split(m.decimal);
  if (extra !== undefined) return { ok: false, reason: `has more than one decimal mark "${m.decimal}"` };
  if (fraction !== undefined && !/^\d+$/.test(fraction)) {
    return fraction.includes("\u0000")
      ? { ok: false, reason: "has a thousands separator after the decimal mark" }
      : { ok: false, reason: `is not a number in the format ${format}` };
  }
  const groups = whole.split("\u0000");
  const wrongDecimal = m.decimal === "," ? "." : ",";
  if (groups.some((g) => g.includes(wrongDecimal)) && !m.groupInput.includes(wrongDecimal)) {
    return {
      ok: false,
      reason: `must use "${m.decimal}" as the decimal mark, not "${wrongDecimal}" (this company writes numbers as ${format})`,
    };
  }
  if (groups.some((g) => !/^\d*$/.test(g))) return { ok: false, reason: `is not a number in the format ${format}` };
  if (whole === "" && fraction === undefined) return { ok: false, reason: "has no digits" };
  if (groups.length > 1) {
    const [first, ...rest] = groups;
    if (!/^\d{1,3}$/.test(first) || rest.some((g) => !/^\d{3}$/.test(g))) {
      return {
        ok: false,
        reason: `must group thousands in threes: in ${format} the decimal mark is "${m.decimal}"`,
      };
    }
  }
  const value = sign * Number(`${groups.join("") || "0"}.${fraction ?? "0"}`);
  if (!Number.isFinite(value)) return { ok: false, reason: "is too large" };
  return { ok: true, value };
}

/** parseGroupedNumber, throwing a field error (for the domain and the server). */
export function readGroupedNumber(text: string, format: NumberFormat, field: string): number {
  const r = parseGroupedNumber(text, format);
  if (!r.ok) throw new DomainInputError(field, r.reason);
  return r.value;
}

/** A number with thousands grouped and exactly `decimals` places, rounded half up, in the company's format. */
export function formatGrouped(value: number, format: NumberFormat, decimals: number): string {
  requireFinite(value, "value");
  const m = MARKS[format];
  const fixed = formatFixed(value, decimals);
  const negative = fixed.startsWith("-");
  const [whole, fraction] = (negative ? fixed.slice(1) : fixed).split(".");
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, m.group);
  return `${negative ? "-" : ""}${grouped}${fraction !== undefined ? m.decimal + fraction : ""}`;
}

/** A number someone typed, in the company's format with every place they gave (up to six): 12.5 → "12,5". */
export function formatAsGiven(value: number, format: NumberFormat): string {
  const places = Math.min(6, (String(value).split(".")[1] ?? "").length);
  return formatGrouped(value, format, places);
}

/**
 * Places worth showing for a measured quantity: whole numbers from 1,000, one place from 10, two
 * from 1, three below (723.50251 t → 723.5 t; 0.04536 kg → 0.045 kg). Common practice, no
 * published source: about four significant figures, never more places than a scale reads.
 */
export function sensibleDecimals(value: number): number {
  const a = Math.abs(value);
  if (a >= 1000) return 0;
  if (a >= 10) return 1;
  if (a >= 1) return 2;
  return 3;
}

/** A quantity in the company's format at sensible precision, trailing zeros after the mark dropped. */
export function formatQuantity(value: number, format: NumberFormat, decimals = sensibleDecimals(value)): string {
  const text = formatGrouped(value, format, decimals);
  const mark = MARKS[format].decimal;
  if (!text.includes(mark)) return text;
  return text.replace(/0+$/, "").replace(new RegExp(`\\${mark}$`), "");
}

/** At most one decimal, none when it is zero: 12, 2.5, 0.3 (the locator's seconds, ppm and ratios). */
export function formatShort(value: number, format: NumberFormat = DEFAULT_NUMBER_FORMAT): string {
  const tenth = roundHalfUp(value, 1);
  return formatGrouped(tenth, format, Number.isInteger(tenth) ? 0 : 1);
}

/** Rounded to `digits` significant figures (an estimate's honest precision): 319,512 → 320,000 at 2. */
export function formatSignificant(value: number, digits: number, format: NumberFormat = DEFAULT_NUMBER_FORMAT): string {
  if (value === 0 || !Number.isFinite(value)) return formatGrouped(0, format, 0);
  const at = (magnitude: number) => {
    const decimals = Math.max(0, digits - 1 - magnitude);
    const step = 10 ** (magnitude - digits + 1);
    return { decimals, rounded: decimals > 0 ? roundHalfUp(value, decimals) : Math.round(value / step) * step };
  };
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  let r = at(magnitude);
  // 0.998 rounds up to 1.0, a figure of the next decade: write it with that decade's decimals
  if (Math.abs(r.rounded) >= 10 ** (magnitude + 1)) r = at(magnitude + 1);
  return formatGrouped(r.rounded, format, r.decimals);
}
