import type { NumberFormat } from "../numbers/number-format";
import { roundHalfUp } from "../numbers/round-half-up";

/**
 * How numbers are written: thousands grouping and decimal mark, named by an example. "1,234.5" is the
 * default (US and UK usage); "1.234,5" and "1 234,5" are the usual decimal-comma forms (ISO 80000-1,
 * 7.3.2, allows a space or a narrow space for grouping).
 */
export type NumberStyle = NumberFormat;

const MARKS: Record<NumberStyle, { group: string; decimal: string }> = {
  "1,234.5": { group: ",", decimal: "." },
  "1.234,5": { group: ".", decimal: "," },
  // a no-break space keeps the groups of one number on one line
  "1 234,5": { group: "\u00a0", decimal: "," },
};

/** `value` rounded half up to `decimals` places and written in `style`, grouped from 1,000 up. */
export function formatNumber(value: number, decimals: number, style: NumberStyle = "1,234.5"): string {
  const rounded = roundHalfUp(value, decimals);
  const [whole, fraction] = Math.abs(rounded).toFixed(decimals).split(".");
  const { group, decimal } = MARKS[style];
  const grouped =
    whole.length > 4 || (whole.length === 4 && style !== "1 234,5") ? groupThousands(whole, group) : whole;
  return `${rounded < 0 ? "-" : ""}${grouped}${fraction ? decimal + fraction : ""}`;
}

function groupThousands(digits: string, mark: string): string {
  const parts: string[] = [];
  for (let end = digits.length; end > 0; end -= 3) parts.unshift(digits.slice(Math.max(0, end - 3), end));
  return parts.join(mark);
}

/** At most one decimal, none when it is zero: 12, 2.5, 0.3. */
export function formatShort(value: number, style: NumberStyle = "1,234.5"): string {
  const tenth = roundHalfUp(value, 1);
  return formatNumber(tenth, Number.isInteger(tenth) ? 0 : 1, style);
}

/** Rounded to `digits` significant figures (an estimate's honest precision): 319,512 → 320,000 at 2. */
export function formatSignificant(value: number, digits: number, style: NumberStyle = "1,234.5"): string {
  if (value === 0 || !Number.isFinite(value)) return formatNumber(0, 0, style);
  const at = (magnitude: number) => {
    const decimals = Math.max(0, digits - 1 - magnitude);
    const step = 10 ** (magnitude - digits + 1);
    return { decimals, rounded: decimals > 0 ? roundHalfUp(value, decimals) : Math.round(value / step) * step };
  };
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  let r = at(magnitude);
  // 0.998 rounds up to 1.0, a figure of the next decade: write it with that decade's decimals
  if (Math.abs(r.rounded) >= 10 ** (magnitude + 1)) r = at(magnitude + 1);
  return formatNumber(r.rounded, r.decimals, style);
}
