// The report font (Atkinson Hyperlegible) lacks some spaces that number formats use: CLDR's French
// grouping is a narrow no-break space, U+202F, for which the font's cmap has no entry (looked up
// with fontkit when this was written). Whatever a layout writes, the page must carry a space the
// font can draw: checked by reading the PDF back with pdfjs-dist (which reads U+00A0 as a space).
import { describe, expect, it } from "vitest";
import { pdfLayout } from "../../tests/helpers/pdf-text";
import { formatGrouped } from "#core/domain/numbers/number-format";
import { printable, reportDocument } from "./report-document";

function pdfOf(write: (doc: PDFKit.PDFDocument) => void): Promise<Buffer> {
  const doc = reportDocument({ size: "A4", margin: 48 });
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on("end", () => resolve(Buffer.concat(chunks))));
  write(doc);
  doc.end();
  return done;
}

describe("report document", () => {
  it("prints the space-grouped number format with a space the report font has", async () => {
    const typed = formatGrouped(1234.5, "1 234,5", 1);
    // Intl (CLDR) groups French numbers with U+202F, which the font cannot draw.
    expect(typed).toBe(new Intl.NumberFormat("fr-FR", { minimumFractionDigits: 1 }).format(1234.5));

    const pdf = await pdfOf((doc) => {
      doc.font("regular").fontSize(11).text(`Full charge ${typed} kg`);
      doc.font("bold").text(typed, { width: doc.widthOfString(typed) + 1 });
    });
    const [page] = await pdfLayout(pdf);
    expect(page.text).toContain("Full charge 1 234,5 kg");
    // Without the stand-in pdfkit writes the missing glyph, which reads back as U+0000.
    expect(page.text).not.toMatch(/[\u0000\u202f]/);
  });

  it("prints a change's arrow, which the font lacks, as a word", async () => {
    const pdf = await pdfOf((doc) => doc.font("regular").fontSize(11).text("refrigerant R-22 → R-448A"));
    const [page] = await pdfLayout(pdf);
    expect(page.text).toContain("refrigerant R-22 to R-448A");
    expect(page.text).not.toMatch(/\u0000/);
  });

  it("keeps every other character as written", () => {
    expect(printable("Dairy 3 – 12,5 lb (5,7 kg) · R-448A")).toBe("Dairy 3 – 12,5 lb (5,7 kg) · R-448A");
    expect(printable("1\u202f234\u2009m")).toBe("1\u00a0234 m");
  });
});
