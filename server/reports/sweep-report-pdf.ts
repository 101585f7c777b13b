/**
 * Lays out a sweep report (US Letter or A4, by the company's rules) with pdfkit: facts, the field map with numbered suspect spots, the
 * findings (confirmed first), the suspect list, diagnostics, the readings table and the safety cautions. Atkinson
 * Hyperlegible is embedded (subset) so accented names print. Resolves with the whole PDF.
 */
import type { SweepReportModel } from "#core/domain/reports/sweep-report-model";
import { reportDocument } from "./report-document";
import { readableSource } from "#core/domain/compliance/citations";
import { findingHeading, findingsWorstFirst, spotsAnswered } from "#core/domain/reports/report-mail-text";

const MARGIN = 48;
const INK = "#1f2430";
const MUTED = "#5b6270";
const RULE = "#c9ccd3";

type Doc = PDFKit.PDFDocument;

function heading(doc: Doc, text: string) {
  if (doc.y > doc.page.height - MARGIN - 80) doc.addPage();
  doc.moveDown(0.8).font("bold").fontSize(13).fillColor(INK).text(text);
  const y = doc.y + 2;
  doc
    .moveTo(MARGIN, y)
    .lineTo(doc.page.width - MARGIN, y)
    .lineWidth(0.5)
    .strokeColor(RULE)
    .stroke();
  doc.moveDown(0.4).font("regular").fontSize(10);
}

function facts(doc: Doc, rows: [string, string][]) {
  const labelW = 130;
  const width = doc.page.width - 2 * MARGIN;
  for (const [k, v] of rows) {
    const y = doc.y;
    doc.font("bold").fontSize(10).fillColor(MUTED).text(k, MARGIN, y, { width: labelW });
    doc
      .font("regular")
      .fillColor(INK)
      .text(v || "—", MARGIN + labelW, y, { width: width - labelW });
    doc.moveDown(0.25);
  }
  doc.x = MARGIN;
}

function fieldMap(doc: Doc, m: NonNullable<SweepReportModel["map"]>, suspects: SweepReportModel["suspects"]) {
  const width = doc.page.width - 2 * MARGIN;
  let h = (width * m.heightM) / m.widthM;
  let w = width;
  const room = doc.page.height - MARGIN - doc.y - 40;
  if (h > room) {
    if (room < 200) {
      doc.addPage();
    }
    const avail = doc.page.height - MARGIN - doc.y - 40;
    if (h > avail) {
      w = (w * avail) / h;
      h = avail;
    }
  }
  const x0 = MARGIN;
  const y0 = doc.y;
  doc.image(m.png, x0, y0, { width: w, height: h });
  const k = w / m.widthM;
  for (const s of suspects) {
    const cx = x0 + s.x * k;
    const cy = y0 + s.y * k;
    const r = Math.max(4, s.radiusM * k);
    const lx = Math.min(x0 + w - 14, cx + r * 0.72);
    const ly = Math.max(y0 + 2, cy - r * 0.72 - 12);
    doc
      .roundedRect(lx - 1, ly - 1, 14, 14, 3)
      .fillColor("#14143c")
      .fill();
    doc
      .font("bold")
      .fontSize(9)
      .fillColor("#ffffff")
      .text(String(s.rank), lx - 1, ly + 1.5, { width: 14, align: "center", lineBreak: false });
  }
  doc.x = MARGIN;
  doc.y = y0 + h + 6;
  doc.font("regular").fontSize(8.5).fillColor(MUTED).text(m.legend, MARGIN, doc.y, { width });
}

function readingsTable(doc: Doc, readings: SweepReportModel["readings"]) {
  // Widths in shares of the text width, so Letter and A4 both fill the line.
  const shares = [
    { key: "n", title: "#", w: 26 },
    { key: "time", title: "Time", w: 50 },
    { key: "raw", title: "Tap position", w: 98 },
    { key: "corrected", title: "Sampled at (corrected)", w: 104 },
    { key: "ppm", title: "ppm", w: 36 },
    { key: "point", title: "Point", w: 80 },
    { key: "note", title: "Note", w: 105 },
  ] as const;
  const k = (doc.page.width - 2 * MARGIN) / shares.reduce((sum, c) => sum + c.w, 0);
  const cols = shares.map((c) => ({ ...c, w: c.w * k }));
  const header = () => {
    let x = MARGIN;
    const y = doc.y;
    doc.font("bold").fontSize(8.5).fillColor(MUTED);
    for (const c of cols) {
      doc.text(c.title, x, y, { width: c.w - 4, lineBreak: false });
      x += c.w;
    }
    doc.y = y + 13;
    doc
      .moveTo(MARGIN, doc.y - 2)
      .lineTo(doc.page.width - MARGIN, doc.y - 2)
      .lineWidth(0.4)
      .strokeColor(RULE)
      .stroke();
  };
  header();
  doc.font("regular").fontSize(8.5).fillColor(INK);
  const bottom = () => doc.page.height - doc.page.margins.bottom;
  for (const r of readings) {
    // Each cell wraps within its column; the row is as tall as its tallest cell, so a long note
    // pushes the next row down instead of printing over it.
    const cells = cols.map((c) => String(r[c.key]));
    const rowH = Math.max(...cells.map((t, i) => doc.heightOfString(t || " ", { width: cols[i].w - 4 })));
    if (doc.y + rowH > bottom()) {
      doc.addPage();
      header();
      doc.font("regular").fontSize(8.5).fillColor(INK);
    }
    let x = MARGIN;
    const y = doc.y;
    cells.forEach((t, i) => {
      doc.text(t, x, y, { width: cols[i].w - 4 });
      x += cols[i].w;
    });
    doc.y = y + rowH + 2;
  }
  doc.x = MARGIN;
}

export function buildSweepReportPdf(m: SweepReportModel): Promise<Buffer> {
  const doc = reportDocument({
    size: m.paper === "a4" ? "A4" : "LETTER",
    margin: MARGIN,
    bufferPages: true,
    info: { Title: m.title, Author: m.company, Subject: `Sweep report for ${m.store.name}`, Creator: "Plumeline" },
  });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("data", (c: Buffer) => chunks.push(c));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });

  doc.font("bold").fontSize(18).fillColor(INK).text(m.title);
  doc.font("regular").fontSize(10).fillColor(MUTED).text([m.company, m.store.address].filter(Boolean).join(" · "));
  doc.moveDown(0.6);
  facts(doc, [
    ["Store", `${m.store.name} (times in ${m.store.timeZone})`],
    ["Started", m.sweep.started],
    ["Submitted", m.sweep.submitted],
    ["Status", m.sweep.status],
    ["Technician", m.sweep.technician],
    ["Conditions", m.sweep.conditions],
    ["Detector", `${m.detector.name} (${m.detector.principle})`],
    ["Calibration / bump check", m.detector.calibration],
    ["Detector settings", m.detector.settings],
    ["Delay check", m.delayCheck],
    ["Background", m.background],
  ]);

  heading(doc, "Field map");
  if (m.map) fieldMap(doc, m.map, m.suspects);
  else doc.fillColor(MUTED).text("No field map: the sweep could not be analysed.");

  // What was found comes before what is only suspected, worst first (as the report e-mail says it).
  heading(doc, "Findings");
  if (m.findings.length === 0) doc.fillColor(INK).text("No findings recorded from this sweep.");
  for (const f of findingsWorstFirst(m.findings)) {
    const spots = spotsAnswered(f, m.suspects);
    const spot = spots.length ? ` (suspect spot ${spots.join(", ")})` : "";
    doc
      .fillColor(INK)
      .text(`• ${findingHeading(f.status)} — ${f.where}${spot}, found ${f.found}${f.note ? `: ${f.note}` : ""}`, {
        indent: 4,
      });
  }

  heading(doc, "Suspect spots");
  if (m.suspects.length === 0) doc.fillColor(INK).text(m.noSpot);
  for (const s of m.suspects) {
    if (doc.y > doc.page.height - MARGIN - 60) doc.addPage();
    doc
      .font("bold")
      .fontSize(10.5)
      .fillColor(INK)
      .text(`${s.rank}. ${s.fixture} — at ${s.position} (within ${s.radius}), score ${s.score}`);
    doc
      .font("regular")
      .fontSize(10)
      .fillColor(INK)
      .text(`${s.reason} Nearest risk point: ${s.riskPoint}. Estimated strength: ${s.strength}.`, { indent: 12 });
    doc.fillColor(MUTED).text(`Next check: ${s.nextCheck}`, { indent: 12 });
    doc.moveDown(0.4);
  }

  for (const a of m.assumptions) doc.font("regular").fontSize(8.5).fillColor(MUTED).text(a);
  doc.fontSize(10);

  heading(doc, "Diagnostics");
  if (m.diagnostics.length === 0) doc.fillColor(INK).text("Nothing to report.");
  for (const d of m.diagnostics) doc.fillColor(INK).text(`• ${d}`, { indent: 4 });

  heading(doc, `Readings (${m.readings.length})`);
  readingsTable(doc, m.readings);

  heading(doc, "Safety");
  for (const c of m.cautions) {
    doc.font("regular").fontSize(9.5).fillColor(INK).text(`• ${c.text}`, { indent: 4 });
    if (readableSource(c.source)) doc.fontSize(8).fillColor(MUTED).text(readableSource(c.source), { indent: 12 });
  }

  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    // The footer sits in the bottom margin: without lifting the margin, pdfkit would start a new
    // (blank) page for it.
    doc.page.margins.bottom = 0;
    const y = doc.page.height - MARGIN + 16;
    doc.font("regular").fontSize(8).fillColor(MUTED);
    doc.text(`${m.store.name} · ${m.generated} · page ${i + 1} of ${range.count}`, MARGIN, y, {
      width: doc.page.width - 2 * MARGIN,
      align: "center",
      lineBreak: false,
    });
  }
  doc.end();
  return done;
}
