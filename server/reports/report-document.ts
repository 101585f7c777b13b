import PDFDocument from "pdfkit";
import { REPORT_FONTS } from "./fonts";

/**
 * Characters the report font has no glyph for, and what prints in their place. The "1 234,5" number
 * format groups with a narrow no-break space (U+202F, as CLDR does); Atkinson Hyperlegible has only
 * the ordinary no-break space, and pdfkit would print a missing glyph as an empty box.
 */
const STAND_INS: Record<string, string> = {
  "\u202F": "\u00A0",
  "\u2009": " ",
  "\u2007": "\u00A0",
  // The font has no arrow: a change "R-22 → R-448A" (system history, audit trail) prints "R-22 to R-448A".
  "\u2192": "to",
};
const MISSING = /[\u202F\u2009\u2007\u2192]/g;

export function printable(text: string): string {
  return text.replace(MISSING, (c) => STAND_INS[c] ?? c);
}

/**
 * A pdfkit document for every report the app prints: the report font registered as "regular" and
 * "bold", and every string measured and written through `printable`, so no layout code has to
 * remember which characters the font lacks.
 */
export function reportDocument(options: PDFKit.PDFDocumentOptions): PDFKit.PDFDocument {
  const doc = new PDFDocument(options);
  doc.registerFont("regular", REPORT_FONTS.regular);
  doc.registerFont("bold", REPORT_FONTS.bold);
  const text = doc.text;
  const widthOf = doc.widthOfString;
  const heightOf = doc.heightOfString;
  const clean = (value: unknown) => (typeof value === "string" ? printable(value) : value);
  doc.text = function (this: PDFKit.PDFDocument, value: unknown, ...rest: unknown[]) {
    return (text as (...args: unknown[]) => PDFKit.PDFDocument).call(this, clean(value), ...rest);
  } as typeof doc.text;
  doc.widthOfString = function (this: PDFKit.PDFDocument, value: string, ...rest: unknown[]) {
    return (widthOf as (...args: unknown[]) => number).call(this, printable(value), ...rest);
  } as typeof doc.widthOfString;
  doc.heightOfString = function (this: PDFKit.PDFDocument, value: string, ...rest: unknown[]) {
    return (heightOf as (...args: unknown[]) => number).call(this, printable(value), ...rest);
  } as typeof doc.heightOfString;
  return doc;
}
