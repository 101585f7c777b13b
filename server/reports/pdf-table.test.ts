/**
 * A table cell taller than a page (a long note in its column, or one unbroken token) is split across
 * pages: it ends, prints nothing past the margins, repeats the header on each page, marks where it is
 * cut and where it continues, and loses no word. Read back with pdfjs-dist (tests/helpers/pdf-text.ts).
 */
import { describe, expect, it } from "vitest";
import { reportDocument } from "./report-document";
import { CONTINUED_MARK, CUT_MARK, drawTable, type PdfColumn } from "./pdf-table";
import { overlappingText, pdfLayout } from "../../tests/helpers/pdf-text";
import { renderPdfPages } from "../../tests/helpers/pdf-pages";

const MARGIN = 50;
const STYLE = { font: "regular", boldFont: "bold", size: 8.5, ink: "#111111", muted: "#555555", rule: "#999999" };
const COLUMNS: PdfColumn[] = [
  { title: "Date", share: 1 },
  { title: "Note", share: 3 },
  { title: "Added", share: 1, align: "right" },
];

/** The table's pages as pdfjs reads them; also rendered to test-results/pdf/<name>-N.png for a person. */
async function tablePdf(name: string, size: "A4" | "LETTER", rows: string[][], columns = COLUMNS) {
  const doc = reportDocument({ size, margin: MARGIN });
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const ended = new Promise((r) => doc.on("end", r));
  doc.font("regular").fontSize(12).text("Leak history");
  drawTable(doc, columns, rows, STYLE);
  doc.end();
  await ended;
  const bytes = new Uint8Array(Buffer.concat(chunks));
  renderPdfPages(bytes, name);
  return pdfLayout(bytes);
}

/** Every text run inside the page's margins (a run's box reaches a little below its baseline). */
function outsideMargins(page: Awaited<ReturnType<typeof tablePdf>>[number]) {
  return page.boxes.filter((b) => b.y < MARGIN - 3 || b.y + b.height > page.height - MARGIN + 3).map((b) => b.str);
}

describe("a table cell taller than a page", () => {
  // 1,500 numbered words: about two A4 pages in a column three fifths of the text width.
  const words = Array.from({ length: 1500 }, (_, i) => `w${i + 1}`);
  const rows = [
    ["2026-03-02", "Dye added at the suction header", "12.0 lb"],
    ["2026-03-09", `Technician's note: ${words.join(" ")}`, "4.5 lb"],
    ["2026-03-16", "Leak at the king valve repaired", "0.0 lb"],
  ];

  for (const size of ["A4", "LETTER"] as const) {
    it(`on ${size}: split across pages under the header, marked, within the margins, no word lost`, async () => {
      const pages = await tablePdf(`pdf-table-split-${size.toLowerCase()}`, size, rows);
      expect(pages.length).toBeGreaterThanOrEqual(2);
      expect(pages.length).toBeLessThanOrEqual(5);
      for (const [n, page] of pages.entries()) {
        expect(outsideMargins(page), `page ${n + 1}`).toEqual([]);
        expect(overlappingText(page), `page ${n + 1}`).toEqual([]);
        expect(page.text, `page ${n + 1}`).toContain("Date");
      }
      // Cut with a mark on every page but the last, continued with a mark on every page but the first.
      const noteParts = pages.map((p) => p.text);
      for (const text of noteParts.slice(0, -1)) expect(text).toMatch(new RegExp(`w\\d+${CUT_MARK}`));
      for (const text of noteParts.slice(1)) expect(text).toContain(CONTINUED_MARK.trim());
      // Every word once, in order; the rows before and after are there too.
      const all = noteParts.join("\n");
      expect([...all.matchAll(/w(\d+)/g)].map((m) => Number(m[1]))).toEqual(words.map((_, i) => i + 1));
      expect(all).toContain("Dye added at the suction header");
      expect(all).toContain("Leak at the king valve repaired");
      // The short cells of the long row print once, on its first page.
      expect(noteParts.filter((t) => t.includes("4.5 lb"))).toHaveLength(1);
      // No time is asserted: pdfkit measures the text many times while splitting, slow on a loaded machine.
    }, 120_000);
  }

  it("an unbroken token longer than a page is cut between characters and still ends", async () => {
    // 1,000 characters in a column a ninth of the width: about two pages. (pdfkit measures a token
    // wider than its column character by character, so a longer one only makes the test slower.)
    const token = "X".repeat(1_000);
    const pages = await tablePdf(
      "pdf-table-token-a4",
      "A4",
      [["2026-03-09", token, "1.0 lb"]],
      [
        { title: "Date", share: 4 },
        { title: "Serial", share: 1 },
        { title: "Added", share: 4 },
      ],
    );
    expect(pages.length).toBeGreaterThanOrEqual(2);
    for (const [n, page] of pages.entries()) expect(outsideMargins(page), `page ${n + 1}`).toEqual([]);
    const xs = pages.map((p) => p.text.replace(/[^X]/g, "").length).reduce((a, b) => a + b, 0);
    expect(xs).toBe(token.length);
  }, 120_000);
});
