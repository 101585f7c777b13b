/**
 * A table for pdfkit that never prints over itself: column widths are shares of the text width (so
 * Letter and A4 both fill the line), every cell wraps inside its column, a row is as tall as its
 * tallest cell, and a row that would cross the bottom margin starts a new page under a repeated header.
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
  for (const cells of rows) {
    const h = rowHeight(cells, style.font);
    if (doc.y + h > bottom()) {
      doc.addPage();
      header();
    }
    drawRow(cells, style.font, style.ink, h);
  }
  doc.x = left;
}
