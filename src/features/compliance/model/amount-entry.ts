import { formatQuantity, parseGroupedNumber, type NumberFormat } from "#core/domain/numbers/number-format";
import type { MassUnit } from "./figures";

export interface ReadAmount {
  /** The number as the server gets it; NaN when it cannot be read, so nothing is guessed. */
  value: number;
  /** Why the text cannot be read ("must group thousands in threes: …"), or null. */
  problem: string | null;
  /** What was read, written back in the company's format ("1.200,5 kg"), or null. */
  echo: string | null;
}

/**
 * A mass typed into a records form, read in the company's number format (docs/decisions/0047):
 * "1.200,5" is twelve hundred and a half to a decimal-comma company, "1,200" is twelve hundred to
 * a decimal-point one. An empty field is a problem only once the form is sent.
 */
export function readAmount(text: string, unit: MassUnit, format: NumberFormat): ReadAmount {
  const parsed = parseGroupedNumber(text, format);
  if (!parsed.ok) return { value: Number.NaN, problem: parsed.reason, echo: null };
  return { value: parsed.value, problem: null, echo: `${formatQuantity(parsed.value, format, 3)} ${unit}` };
}

/** The hint under a mass field: what it read, or how to write one. */
export function amountHint(text: string, read: ReadAmount, format: NumberFormat): string {
  return text.trim() !== "" && read.echo ? `Read as ${read.echo}` : `Written as ${format}`;
}
