/**
 * A table for pdfkit that never prints over itself: column widths are shares of the text width (so
 * Letter and A4 both fill the line), every cell wraps inside its column, a row is as tall as its
 * tallest cell, and a row that would cross the bottom margin starts a new page under a repeated header.
 * A row taller than a whole page is split: what fits goes on this page with each cut cell ending in
 * "…", and the rest follows on the next, under the header, each continued cell starting "(continued)".
 * Nothing is lost and nothing runs past the bottom margin (docs/decisions/0120).
 */
type Doc = PDFKit.PDFDocument;

export interface PdfColumn {
  title: string;
  /** Relative width; the shares of a table are scaled to the text width. */
  share: number;
  align?: "left" | "right";
}

export interface PdfTableStyle {
  font: string;
  boldFont: string;
  size: number;
  ink: string;
  muted: string;
  rule: string;
}

const GUTTER = 6;
const ROW_GAP = 3;
/** Ends the part of a cell printed before a page break, and starts the rest on the next page. */
export const CUT_MARK = "…";
export const CONTINUED_MARK = "(continued) ";

/**
 * How much of `text` fits in `room` points of height after `prefix` and with the cut mark after it,
 * and the rest. Cut between words when a word boundary fits, else between characters (a long token).
 */
function splitToFit(text: string, prefix: string, room: number, height: (t: string) => number): [string, string] {
  const fits = (n: number) => height(prefix + text.slice(0, n).trimEnd() + CUT_MARK) <= room;
  // Galloping first, so each measure is of about a page of text, not of the whole cell.
  let lo = 0;
  let hi = Math.min(64, text.length);
  while (hi < text.length && fits(hi)) [lo, hi] = [hi, Math.min(2 * hi, text.length)];
  if (hi === text.length && fits(hi)) return [text, ""];
  hi -= 1;
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2);
    if (fits(mid)) lo = mid;
    else hi = mid - 1;
  }
  let cut = lo;
  const space = text.lastIndexOf(" ", cut);
  if (cut > 0 && cut < text.length && text[cut] !== " " && space > 0) cut = space;
  return [text.slice(0, cut).trimEnd(), text.slice(cut).trimStart()];
}

export function drawTable(doc: Doc, columns: PdfColumn[], rows: string[][], style: PdfTableStyle): void {
  const left = doc.page.margins.left;
  const textWidth = doc.page.width - left - doc.page.margins.right;
  const total = columns.reduce((s, c) => s + c.share, 0);
  const widths = columns.map((c) => (c.share / total) * textWidth);
  const bottom = () => doc.page.height - doc.page.margins.bottom;

  const rowHeight = (cells: string[], font: string) => {
    doc.font(font).fontSize(style.size);
    return Math.max(...cells.map((t, i) => doc.heightOfString(t || " ", { width: widths[i] - GUTTER })));
  };
  const drawRow = (cells: string[], font: string, colour: string, height: number) => {
    const y = doc.y;
    let x = left;
    doc.font(font).fontSize(style.size).fillColor(colour);
    cells.forEach((t, i) => {
      doc.text(t, x, y, { width: widths[i] - GUTTER, align: columns[i].align ?? "left" });
      x += widths[i];
    });
    doc.x = left;
    doc.y = y + height + ROW_GAP;
  };
  const header = () => {
    const titles = columns.map((c) => c.title);
    drawRow(titles, style.boldFont, style.muted, rowHeight(titles, style.boldFont));
    doc
      .moveTo(left, doc.y - ROW_GAP / 2)
      .lineTo(left + textWidth, doc.y - ROW_GAP / 2)
      .lineWidth(0.4)
      .strokeColor(style.rule)
      .stroke();
    doc.y += 1;
  };

  const headerHeight = rowHeight(
    columns.map((c) => c.title),
    style.boldFont,
  );
  // Keep the header with its first row.
  if (rows.length && doc.y + headerHeight + rowHeight(rows[0], style.font) + 2 * ROW_GAP > bottom()) doc.addPage();
  header();
  const cellHeight = (i: number) => (t: string) => {
    doc.font(style.font).fontSize(style.size);
    return doc.heightOfString(t || " ", { width: widths[i] - GUTTER });
  };
  const lineHeight = cellHeight(0)(" ");
  // Where rows start on a page after its header.
  const pageTop = () => doc.page.margins.top + headerHeight + ROW_GAP + 1;
  const newPage = () => {
    doc.addPage();
    header();
  };
  for (const row of rows) {
    let rest = row;
    let continued = row.map(() => false);
    const shown = () => rest.map((t, i) => (continued[i] ? CONTINUED_MARK + t : t));
    for (;;) {
      const cells = shown();
      const h = rowHeight(cells, style.font);
      if (doc.y + h <= bottom()) {
        drawRow(cells, style.font, style.ink, h);
        break;
      }
      // A row that fits on a page starts the next one; a taller one is split where it stands,
      // unless only a few lines are left here.
      if (h <= bottom() - pageTop() || bottom() - doc.y < 4 * lineHeight) {
        newPage();
        if (doc.y + h <= bottom()) continue;
      }
      const room = bottom() - doc.y;
      const parts = rest.map((t, i) => {
        const prefix = continued[i] ? CONTINUED_MARK : "";
        return cellHeight(i)(prefix + t) <= room ? [t, ""] : splitToFit(t, prefix, room, cellHeight(i));
      });
      // Each pass prints some of the row, so it ends. If none would fit (a page shorter than one line,
      // which no style the app uses comes near), what is left is printed cut to the page instead.
      const length = (cells: string[]) => cells.reduce((n, t) => n + t.length, 0);
      if (length(parts.map(([, after]) => after)) >= length(rest)) {
        const cut = shown().map((t, i) => {
          const [head, after] = splitToFit(t, "", room, cellHeight(i));
          return after ? head + CUT_MARK : head;
        });
        drawRow(cut, style.font, style.ink, room);
        break;
      }
      const head = parts.map(
        ([first, after], i) => (continued[i] ? CONTINUED_MARK : "") + first + (after ? CUT_MARK : ""),
      );
      drawRow(head, style.font, style.ink, rowHeight(head, style.font));
      continued = parts.map(([, after]) => after !== "");
      rest = parts.map(([, after]) => after);
      newPage();
    }
  }
  doc.x = left;
}
