import { refrigerantCell } from "./records-csv";
import { EXCLUSION_NAMES, type SystemRecordsView } from "#core/contracts/compliance";
import type { FindingDetail } from "#core/contracts/finding-actions";
import { COMPONENT_LABELS, FINDING_EVENT_LABELS } from "#core/contracts/findings";
import { APPLIANCE_TYPE_NAMES } from "#core/contracts/systems";
import { revisionHistory, type RevisionRow } from "#core/domain/compliance/revision-changes";
import { citedWithAcceptance } from "#core/domain/compliance/readings";
import { readableAuditEntry } from "#core/domain/compliance/audit-entry";
import { retireReasonWords } from "#core/domain/compliance/retirement-words";
import { findingStateWords } from "#core/domain/findings/left-service";
import { statementTitle } from "#core/domain/compliance/company-profile";
import { formatCalendarDay as day, formatInZone } from "#core/domain/dates/format-in-zone";
import { formatAsGiven, formatGrouped, formatQuantity, type NumberFormat } from "#core/domain/numbers/number-format";
import type { Paper } from "#core/domain/reports/paper";
import { formatRecordMass, type MassPreference } from "#core/domain/units/format-units";
import { drawTable, type PdfColumn } from "../../reports/pdf-table";
import { reportDocument } from "../../reports/report-document";

const MARGIN = 48;
const INK = "#1f2430";
const MUTED = "#5b6270";
const RULE = "#c9ccd3";
const TABLE = { font: "regular", boldFont: "bold", size: 8.5, ink: INK, muted: MUTED, rule: RULE };

type Doc = PDFKit.PDFDocument;

/** Why a finding was dismissed, in words (the screen's dismiss form offers the same three). */
const DISMISS_REASON_WORDS: Record<string, string> = {
  "benign-source": "a benign source, not a leak",
  "no-leak-found": "no leak found",
  other: "other reason, see the note",
};

export interface StatementOptions {
  /** US Letter or A4: the company's paper setting (core/domain/reports/paper.ts). */
  paper: Paper;
  /** The company's mass unit, printed first; the other follows in brackets (statements go to non-members). */
  massUnit: MassPreference;
  /** The company's number format ("1,234.5", "1.234,5", "1 234,5"); figures are grouped in it. */
  numberFormat?: NumberFormat;
  /** The readings the owner has accepted (their words): each "reading" marker says whether it is; null leaves them plain. */
  acceptedReadings?: ReadonlySet<string> | null;
  generatedAt?: Date;
}

/** A rule source as the page prints it. */
type Cite = (source: string) => string;

function heading(doc: Doc, text: string) {
  // Keep a heading with at least a few lines of what follows it.
  if (doc.y > doc.page.height - doc.page.margins.bottom - 70) doc.addPage();
  doc.moveDown(0.7).font("bold").fontSize(12).fillColor(INK).text(text, MARGIN);
  doc.moveDown(0.25).font("regular").fontSize(9.5);
}

function para(doc: Doc, text: string, colour = INK, size = 9.5) {
  doc
    .font("regular")
    .fontSize(size)
    .fillColor(colour)
    .text(text, MARGIN, doc.y, { width: doc.page.width - 2 * MARGIN });
}

function table(doc: Doc, columns: PdfColumn[], rows: string[][]) {
  doc.moveDown(0.2);
  drawTable(doc, columns, rows, TABLE);
}

function systemSection(
  doc: Doc,
  r: SystemRecordsView,
  mass: (kg: number) => string,
  cite: Cite,
  format: NumberFormat = "1,234.5",
) {
  heading(doc, "System");
  const gwp = r.system.refrigerant.gwp;
  para(
    doc,
    `Refrigerant ${refrigerantCell(r.system.refrigerant)} (safety class ${r.system.refrigerant.safetyClass}${gwp ? `, GWP ${formatGrouped(gwp.value, format, 0)} on ${gwp.basis}` : ""}); full charge ${mass(r.system.fullChargeKg)}.`,
  );
  para(
    doc,
    `${APPLIANCE_TYPE_NAMES[r.system.applianceType]}; automatic leak detection: ${r.system.automaticLeakDetection ? "yes" : "no"}${r.profile.wording === "eu" || r.system.hermeticallySealed ? `; hermetically sealed: ${r.system.hermeticallySealed ? "yes (factory-sealed, labelled as such)" : "no"}` : ""}.`,
  );
  if (r.co2e.known && r.co2e.tonnes !== null)
    para(
      doc,
      `CO2-equivalent of the charge: ${formatQuantity(r.co2e.tonnes, format)} t (kg × GWP ${r.co2e.gwp === null ? "unknown" : formatGrouped(r.co2e.gwp, format, 0)} / 1000; GWP source ${cite(r.co2e.source)}).`,
    );
  if (gwp) para(doc, `GWP basis: ${gwp.statement}.`);
  // A retired system's statement says so: its records stay, and until when the rule asks for them
  // (docs/decisions/0040-no-record-is-lost.md).
  if (r.system.retired)
    para(
      doc,
      `Retired on ${day(r.system.retired.on)}${retireReasonWords(r.system.retired) ? ` (${retireReasonWords(r.system.retired)})` : ""}; no repair, test or leak check falls due from then, and its records are kept${r.retention.keptUntil ? ` at least until ${day(r.retention.keptUntil)}` : ""}.`,
    );
}

const KIND_WORDS: Record<RevisionRow["kind"], string> = {
  first: "first values",
  change: "change",
  correction: "correction",
  retrofit: "retrofit",
};

function historySection(
  doc: Doc,
  r: SystemRecordsView,
  revisions: readonly RevisionRow[],
  mass: (kg: number) => string,
) {
  // Why a figure uses the charge it uses: each figure reads the values in force on its own date
  // (docs/decisions/0043-system-revisions.md, 0126-system-history-on-the-statement.md).
  heading(doc, "System history");
  if (!revisions.length) {
    para(doc, "No dated values recorded: every figure uses the values above.");
    return;
  }
  para(doc, "Each figure below uses the values in force on its own date: from a revision's day until the next one.");
  table(
    doc,
    [
      { title: "From", share: 62 },
      { title: "Kind", share: 56 },
      { title: "Values set", share: 170 },
      { title: "Reason", share: 100 },
      { title: "Recorded", share: 98 },
    ],
    revisionHistory(revisions, mass).map(({ revision: v, changes }) => [
      day(v.effectiveFrom),
      KIND_WORDS[v.kind],
      changes,
      v.reason,
      `${v.by ? `${v.by}, ` : ""}${formatInZone(v.recordedAt, r.store.timeZone, "date")}`,
    ]),
  );
}

function profileSection(doc: Doc, r: SystemRecordsView, cite: Cite) {
  heading(doc, "Rule profile");
  para(
    doc,
    r.profile.leakRateRules
      ? `${r.profile.name}; leak-rate method: ${r.profile.method === "annualizing" ? "annualizing" : "rolling average"}.`
      : `${r.profile.name}: leak checks at intervals set by the charge's CO2-equivalent; a re-check after every repair.`,
  );
  if (r.profile.leakRateRules)
    para(
      doc,
      r.applicability.applies
        ? `Applies: ${r.applicability.reason}. Threshold ${r.applicability.thresholdPercent} % per year (${cite(r.applicability.thresholdSource ?? "")}).`
        : `No leak-rate threshold applies: ${r.applicability.reason}.`,
    );
  if (r.leakCheck)
    para(
      doc,
      `Leak checks: ${r.leakCheck.reason}.${r.leakCheck.withoutLdsMonths !== null && r.leakCheck.withLdsMonths !== null ? ` Without a leak detection system every ${r.leakCheck.withoutLdsMonths} months, with one every ${r.leakCheck.withLdsMonths} months.` : ""}`,
    );
  if (r.nextInspection)
    para(
      doc,
      `${r.profile.wording === "eu" ? "Next leak check" : "Next inspection"} due ${day(r.nextInspection.dueOn)} (${r.nextInspection.reason}; ${cite(r.nextInspection.source)}).`,
    );
}

/** A percentage in the company's number format: one place for a computed rate, every place given for a rule's threshold. */
function percentWords(format: NumberFormat) {
  return {
    rate: (p: number) => `${formatGrouped(p, format, 1)} %`,
    rule: (p: number) => `${formatAsGiven(p, format)} %`,
  };
}

function leakRateSection(
  doc: Doc,
  r: SystemRecordsView,
  mass: (kg: number) => string,
  cite: Cite,
  pct: ReturnType<typeof percentWords>,
) {
  heading(doc, "Leak rate at every addition");
  const byId = new Map(r.additions.map((a) => [a.id, a]));
  const rows = r.leakRates.map((p) => [
    day(p.date),
    mass(p.additionIds.reduce((s, id) => s + (byId.get(id)?.amountKg ?? 0), 0)),
    p.method === "annualizing" ? `${p.days} d` : `from ${day(p.windowStart)}`,
    mass(p.countedKg),
    `${pct.rate(p.percent)}${p.exceeds ? " (above)" : ""}`,
    // Each figure cites the part in force on its own date (after a retrofit, earlier figures keep theirs).
    p.thresholdPercent === null
      ? "none"
      : `${pct.rule(p.thresholdPercent)}${p.thresholdSource ? ` (${cite(p.thresholdSource)})` : ""}`,
    day(p.repairDue),
  ]);
  if (rows.length)
    table(
      doc,
      [
        { title: "Date", share: 62 },
        { title: "Added", share: 80 },
        { title: r.profile.method === "annualizing" ? "Days" : "Window", share: 44 },
        { title: "Counted", share: 80 },
        { title: "Leak rate", share: 58, align: "right" },
        { title: "Threshold (rule)", share: 104 },
        { title: "Repair due", share: 58 },
      ],
      rows,
    );
  else
    para(
      doc,
      r.additions.some((a) => !a.voided)
        ? "No leak-rate figure: the refrigerant added was excluded from the calculation."
        : "No leak-rate figure yet: no refrigerant has been added.",
    );
  doc.moveDown(0.3);
  para(
    doc,
    r.profile.method === "annualizing"
      ? "Annualizing method (40 CFR 82.152 / 84.102): leak rate % = (added ÷ full charge) ÷ (days ÷ 365) × 100, where days is the shorter of the days since the previous addition and 365."
      : "Rolling-average method (40 CFR 82.152 / 84.102): added in the previous 365 days (or since the last follow-up verification test) ÷ full charge × 100.",
    MUTED,
    8,
  );
}

/**
 * Every live charge-added entry. Under leak-rate rules each says whether the leak rate counts it: an
 * auditor finds the fill after a retrofit (no figure, 40 CFR 82.157) here, not only its absence from
 * the figures.
 */
function additionsSection(doc: Doc, r: SystemRecordsView, mass: (kg: number) => string) {
  heading(doc, "Refrigerant added");
  const live = r.additions.filter((a) => !a.voided);
  if (live.length === 0) return para(doc, "No refrigerant has been added.");
  if (!r.profile.leakRateRules)
    return table(
      doc,
      [
        { title: "Date", share: 62 },
        { title: "Amount", share: 92 },
        { title: "Technician", share: 110 },
        { title: "Reason", share: 222 },
      ],
      live.map((a) => [day(a.addedOn), mass(a.amountKg), a.technician, a.reason]),
    );
  table(
    doc,
    [
      { title: "Date", share: 62 },
      { title: "Amount", share: 92 },
      { title: "Technician", share: 96 },
      { title: "Reason", share: 136 },
      { title: "Leak rate", share: 100 },
    ],
    live.map((a) => [
      day(a.addedOn),
      mass(a.amountKg),
      a.technician,
      a.reason,
      a.excluded ? `not counted: ${EXCLUSION_NAMES[a.excluded]}` : "counted",
    ]),
  );
}

function euRecordsSection(doc: Doc, r: SystemRecordsView, mass: (kg: number) => string) {
  // EU F-gas: no leak-rate threshold; the record is the refrigerant added and the leak checks.
  additionsSection(doc, r, mass);
  heading(doc, "Leak checks");
  if (r.leakChecks.length === 0) para(doc, "No leak check recorded.");
  else
    table(
      doc,
      [
        { title: "Date", share: 62 },
        { title: "Result", share: 80 },
        { title: "Checked by", share: 110 },
        { title: "Note", share: 234 },
      ],
      r.leakChecks.map((c) => [day(c.checkedOn), c.leakFound ? "leak found" : "no leak found", c.by, c.note]),
    );
  ldsChecksSection(doc, r);
}

/** Checks of the leak detection system itself (EU, where one is mandatory: at least every 12 months, decision 0123). */
function ldsChecksSection(doc: Doc, r: SystemRecordsView) {
  if (!r.leakDetectionCheckOwed && r.leakDetectionChecks.length === 0) return;
  heading(doc, "Checks of the leak detection system");
  if (r.leakDetectionChecks.length === 0) para(doc, "No check of the leak detection system recorded.");
  else
    table(
      doc,
      [
        { title: "Date", share: 62 },
        { title: "Result", share: 80 },
        { title: "Checked by", share: 110 },
        { title: "Note", share: 234 },
      ],
      r.leakDetectionChecks.map((c) => [day(c.checkedOn), c.working ? "working" : "fault found", c.by, c.note]),
    );
}

function chronicSection(
  doc: Doc,
  r: SystemRecordsView,
  mass: (kg: number) => string,
  cite: Cite,
  pct: ReturnType<typeof percentWords>,
) {
  if (!r.chronic.length) return;
  heading(doc, "Added per calendar year");
  table(
    doc,
    [
      { title: "Year", share: 40 },
      { title: "Added", share: 92 },
      { title: "Of full charge", share: 64, align: "right" },
      { title: "Chronic leaker", share: 290 },
    ],
    r.chronic.map((y) =>
      // A year no leak-repair part reached is listed so the totals add up, and not judged (decision 0127).
      y.noPart !== null
        ? [String(y.year), mass(y.notCountedKg), "—", `not counted: no leak-repair part applied (${y.noPart})`]
        : [
            String(y.year),
            mass(y.addedKg),
            pct.rate(y.percent),
            `${
              y.chronic
                ? y.filed
                  ? `yes; report filed on ${day(y.filed.on)} by ${y.filed.by}${y.filed.reference ? ` (reference ${y.filed.reference})` : ""}`
                  : `yes; report due ${day(y.reportDue)}`
                : "no"
            }${y.notCountedKg > 0 ? `; ${mass(y.notCountedKg)} more added while no part applied, not counted` : ""}`,
          ],
    ),
  );
  if (r.chronicRule)
    para(
      doc,
      `Chronic leaker from ${pct.rule(r.chronicRule.percent)} of the full charge in a calendar year, reported by ${r.chronicRule.reportBy} (${cite(r.chronicRule.source)}).`,
    );
}

function voidedSection(doc: Doc, r: SystemRecordsView, mass: (kg: number) => string) {
  const voided = r.additions.filter((a) => a.voided);
  if (!voided.length) return;
  heading(doc, "Corrected or voided entries (kept for the audit trail)");
  table(
    doc,
    [
      { title: "Date", share: 62 },
      { title: "Amount", share: 92 },
      { title: "Technician", share: 100 },
      { title: "Voided", share: 110 },
      { title: "Why", share: 122 },
    ],
    voided.map((a) => [
      day(a.addedOn),
      mass(a.amountKg),
      a.technician,
      `${formatInZone(a.voided!.at, r.store.timeZone, "date")} by ${a.voided!.by}`,
      a.voided!.reason,
    ]),
  );
}

function findingsSection(doc: Doc, findingList: FindingDetail[]) {
  heading(doc, "Findings");
  if (findingList.length === 0) para(doc, "No findings on this system.");
  for (const f of findingList) {
    if (doc.y > doc.page.height - doc.page.margins.bottom - 50) doc.addPage();
    doc
      .moveDown(0.3)
      .font("bold")
      .fontSize(9.5)
      .fillColor(INK)
      .text(
        `${f.component ? COMPONENT_LABELS[f.component] : "Component not recorded"} – ${findingStateWords(f)}${f.dismissReason ? ` (${DISMISS_REASON_WORDS[f.dismissReason] ?? f.dismissReason})` : ""}`,
        MARGIN,
      );
    table(
      doc,
      [
        { title: "Date", share: 62 },
        { title: "Step", share: 120 },
        { title: "Signed", share: 110 },
        { title: "Note", share: 194 },
      ],
      f.events.map((e) => [
        day(e.on),
        `${FINDING_EVENT_LABELS[e.kind]}${e.result ? ` (${e.result})` : ""}`,
        e.by,
        e.note,
      ]),
    );
  }
}

function dueSection(doc: Doc, r: SystemRecordsView, cite: Cite) {
  if (!r.due.length) return;
  heading(doc, "Due");
  table(
    doc,
    [
      { title: "Due", share: 62 },
      { title: "State", share: 62 },
      { title: "What", share: 212 },
      { title: "Rule", share: 150 },
    ],
    r.due.map((d) => [d.dueOn ? day(d.dueOn) : "no date", d.state.replace("-", " "), d.what, cite(d.source)]),
  );
}

function auditSection(doc: Doc, r: SystemRecordsView) {
  if (!r.audit.length) return;
  // Oldest first, as an auditor reads a trail; moments on the store's clock (docs/decisions/0125).
  heading(doc, "Audit trail");
  table(
    doc,
    [
      { title: "When (store time)", share: 110 },
      { title: "By", share: 100 },
      { title: "What", share: 276 },
    ],
    [...r.audit].reverse().map((a) => {
      const e = readableAuditEntry(a, r.store.timeZone);
      return [e.when, e.by, e.summary];
    }),
  );
}

function recordKeepingSection(doc: Doc, r: SystemRecordsView, cite: Cite) {
  heading(doc, "Record keeping and safety");
  para(
    doc,
    "“reading”: how the product applies a rule whose text it has not confirmed; every reading is listed once on the company's rule-profile page (Settings, Readings).",
  );
  para(doc, `Keep these records for at least ${r.profile.retentionYears} years (${cite(r.profile.retentionSource)}).`);
  para(
    doc,
    r.profile.wording === "eu"
      ? "Only certified personnel check for leaks, recover, install or service equipment containing fluorinated gases (Regulation (EU) 2024/573). Local codes and licensed practice govern."
      : "Only certified technicians attach gauges or add or remove refrigerant (in the US, EPA Section 608). Local codes and licensed practice govern.",
  );
}

/** `text`, cut with an ellipsis to fit `width` at the current font: a footer stays on its one line. */
function fitted(doc: Doc, text: string, width: number): string {
  if (doc.widthOfString(text) <= width) return text;
  let cut = text;
  while (cut.length > 1 && doc.widthOfString(`${cut}…`) > width) cut = cut.slice(0, -1);
  return `${cut.trimEnd()}…`;
}

function footers(doc: Doc, r: SystemRecordsView, generated: string) {
  const range = doc.bufferedPageRange();
  const width = doc.page.width - 2 * MARGIN;
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    // The footer sits in the bottom margin: without lifting the margin pdfkit would start a blank page for it.
    doc.page.margins.bottom = 0;
    const y = doc.page.height - MARGIN + 16;
    const page = `page ${i + 1} of ${range.count}`;
    doc.font("regular").fontSize(8).fillColor(MUTED);
    const pageWidth = doc.widthOfString(page);
    doc.text(page, MARGIN + width - pageWidth, y, { lineBreak: false });
    const title = fitted(doc, `${r.system.name} · ${r.store.name} · ${generated}`, width - pageWidth - 16);
    doc.text(title, MARGIN, y, { lineBreak: false });
  }
}

/**
 * The leak-rate statement of one system as a PDF: what the system is, which rule applies and
 * why, the leak rate at every addition against the threshold, the findings and their steps, due
 * dates, and how long the records must be kept. Built from the same records the screen shows.
 */
export function leakRateStatementPdf(
  r: SystemRecordsView,
  findingList: FindingDetail[],
  options: StatementOptions,
  /** The system's dated revisions in effect order (GET /api/systems/:id/revisions). */
  revisions: readonly RevisionRow[],
): Promise<Buffer> {
  const doc = reportDocument({
    size: options.paper === "a4" ? "A4" : "LETTER",
    margin: MARGIN,
    bufferPages: true,
    info: { Title: `${statementTitle(r.profile.leakRateRules)} – ${r.system.name}`, Creator: "Plumeline" },
  });
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });
  const mass = (kg: number) => formatRecordMass(kg, options.massUnit, options.numberFormat);
  const pct = percentWords(options.numberFormat ?? "1,234.5");
  const cite = (source: string) => citedWithAcceptance(source, options.acceptedReadings ?? null);
  const generated = `made ${formatInZone(options.generatedAt ?? new Date(), r.store.timeZone, "dateTime")}`;

  doc.font("bold").fontSize(17).fillColor(INK).text(statementTitle(r.profile.leakRateRules), MARGIN);
  para(doc, `${r.system.name} · ${r.store.name}`, INK, 10);
  para(
    doc,
    `${generated}; dates are on the store's calendar (${r.store.timeZone}); today is ${day(r.today)}.`,
    MUTED,
    8.5,
  );

  systemSection(doc, r, mass, cite, options.numberFormat ?? "1,234.5");
  historySection(doc, r, revisions, mass);
  profileSection(doc, r, cite);
  if (r.profile.leakRateRules) {
    additionsSection(doc, r, mass);
    leakRateSection(doc, r, mass, cite, pct);
  } else euRecordsSection(doc, r, mass);
  chronicSection(doc, r, mass, cite, pct);
  voidedSection(doc, r, mass);
  findingsSection(doc, findingList);
  dueSection(doc, r, cite);
  auditSection(doc, r);
  recordKeepingSection(doc, r, cite);
  footers(doc, r, generated);
  doc.end();
  return done;
}
