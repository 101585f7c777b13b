import Papa from "papaparse";

/**
 * CSV that is safe to open in a spreadsheet (OWASP "CSV Injection"): a text cell that begins with
 * =, +, -, @, tab or carriage return — or a line feed, or the full-width =, +, - and @ some
 * spreadsheets also accept — is written with a leading single quote, so it is shown as text and never
 * run as a formula. Numbers are passed as numbers and left alone, so negative values stay numeric.
 * papaparse writes the quoting (RFC 4180) and applies the escape (`escapeFormulae`).
 */
export const FORMULA_LEADING = /^[=+\-@\t\r\n\uFF1D\uFF0B\uFF0D\uFF20]/;

export function unparseCsv(input: Parameters<typeof Papa.unparse>[0]): string {
  return Papa.unparse(input, { newline: "\r\n", escapeFormulae: FORMULA_LEADING });
}
