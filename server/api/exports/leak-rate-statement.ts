import PDFDocument from "pdfkit";
import type { SystemRecordsView } from "#core/contracts/compliance";
import type { FindingDetail } from "#core/contracts/finding-actions";
import { APPLIANCE_TYPE_NAMES } from "#core/contracts/systems";
import { statementFonts } from "./fonts";
import { readableSource } from "#core/domain/compliance/citations";
import { DEFAULT_MASS_DISPLAY, printMass, type MassDisplay } from "./company-display";

/**
 * The leak-rate statement of one system as a PDF: what the system is, which rule applies and
 * why, the leak rate at every addition against the threshold, the findings and their steps, due
 * dates, and how long the records must be kept. Built from the same records the screen shows.
 */
export function leakRateStatementPdf(
  r: SystemRecordsView,
  findingList: FindingDetail[],
  generatedAt = new Date(),
  display: MassDisplay = DEFAULT_MASS_DISPLAY,
): Promise<Buffer> {
  const fonts = statementFonts();
  const doc = new PDFDocument({
    size: "A4",
    margin: 48,
    info: { Title: `Leak-rate statement – ${r.system.name}`, Creator: "Plumeline" },
  });
  doc.registerFont("body", fonts.regular);
  doc.registerFont("bold", fonts.bold);
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });

  const h = (text: string) =>
    doc.moveDown(0.6).font("bold").fontSize(12).text(text).moveDown(0.2).font("body").fontSize(9.5);
  const line = (text: string) => doc.text(text);
  // The company's unit first, grouped in its number format (docs/decisions/0047-company-number-format.md).
  const mass = (kg: number) => printMass(kg, display);

  doc.font("bold").fontSize(17).text("Leak-rate statement");
  doc.font("body").fontSize(10).text(`${r.system.name} · ${r.store.name}`);
  doc
    .fontSize(8.5)
    .fillColor("#444")
    .text(
      `Generated ${generatedAt.toISOString().slice(0, 16).replace("T", " ")} UTC; dates are on the store's calendar (${r.store.timeZone}); today there is ${r.today}.`,
    )
    .fillColor("black");

  h("System");
  line(
    `Refrigerant ${r.system.refrigerantId} (safety class ${r.system.refrigerant.safetyClass}${r.system.refrigerant.gwp ? `, GWP ${r.system.refrigerant.gwp.value} on ${r.system.refrigerant.gwp.basis}` : ""}); full charge ${mass(r.system.fullChargeKg)}.`,
  );
  line(
    `${APPLIANCE_TYPE_NAMES[r.system.applianceType]}; automatic leak detection: ${r.system.automaticLeakDetection ? "yes" : "no"}.`,
  );
  if (r.co2e.known && r.co2e.tonnes !== null)
    line(
      `CO2-equivalent of the charge: ${r.co2e.tonnes.toFixed(2)} t (kg × GWP ${r.co2e.gwp} / 1000; GWP source ${readableSource(r.co2e.source)}).`,
    );
  if (r.system.refrigerant.gwp) line(`GWP basis: ${r.system.refrigerant.gwp.statement}.`);

  h("Rule profile");
  line(
    r.profile.leakRateRules
      ? `${r.profile.name}; leak-rate method: ${r.profile.method === "annualizing" ? "annualizing" : "rolling average"}.`
      : `${r.profile.name}: leak checks at intervals set by the charge's CO2-equivalent; a re-check after every repair.`,
  );
  if (r.profile.leakRateRules)
    line(
      r.applicability.applies
        ? `Applies: ${r.applicability.reason}. Threshold ${r.applicability.thresholdPercent} % per year (${readableSource(r.applicability.thresholdSource ?? "")}).`
        : `No leak-rate threshold applies: ${r.applicability.reason}.`,
    );
  if (r.leakCheck)
    line(
      `Leak checks: ${r.leakCheck.reason}.${r.leakCheck.withoutLdsMonths !== null && r.leakCheck.withLdsMonths !== null ? ` Without a leak detection system every ${r.leakCheck.withoutLdsMonths} months, with one every ${r.leakCheck.withLdsMonths} months.` : ""}`,
    );
  if (r.nextInspection)
    line(
      `Next inspection due ${r.nextInspection.dueOn} (${r.nextInspection.reason}; ${readableSource(r.nextInspection.source)}).`,
    );

  if (r.profile.leakRateRules) {
    h("Leak rate at every addition");
    const cols = [48, 118, 190, 262, 330, 400, 470];
    const row = (cells: string[], bold = false) => {
      const y = doc.y;
      doc.font(bold ? "bold" : "body").fontSize(8.5);
      cells.forEach((c, i) => doc.text(c, cols[i], y, { width: (cols[i + 1] ?? 547) - cols[i] - 4, lineBreak: false }));
      doc.x = 48;
      doc.y = y + 13;
      if (doc.y > 760) doc.addPage();
    };
    row(["Date", "Added", "Days / window", "Counted", "Leak rate", "Threshold", "Repair due"], true);
    const byId = new Map(r.additions.map((a) => [a.id, a]));
    for (const p of r.leakRates) {
      const added = p.additionIds.reduce((s, id) => s + (byId.get(id)?.amountKg ?? 0), 0);
      row([
        p.date,
        mass(added),
        p.method === "annualizing" ? `${p.days} d` : `${p.windowStart} →`,
        mass(p.countedKg),
        `${p.percent.toFixed(1)} %${p.exceeds ? " (above)" : ""}`,
        p.thresholdPercent === null ? "none" : `${p.thresholdPercent} %`,
        p.repairDue ?? "",
      ]);
    }
    if (r.leakRates.length === 0)
      line(
        r.additions.some((a) => !a.voided)
          ? "No leak-rate figure: the refrigerant added was excluded from the calculation."
          : "No refrigerant has been added.",
      );
    doc
      .font("body")
      .fontSize(8)
      .fillColor("#444")
      .text(
        r.profile.method === "annualizing"
          ? "Annualizing method (40 CFR 82.152 / 84.102): leak rate % = (added ÷ full charge) ÷ (days ÷ 365) × 100, where days is the shorter of the days since the previous addition and 365."
          : "Rolling-average method (40 CFR 82.152 / 84.102): added in the previous 365 days (or since the last follow-up verification test) ÷ full charge × 100.",
        48,
      )
      .fillColor("black")
      .fontSize(9.5);
  } else {
    // EU F-gas: no leak-rate threshold; the record is the refrigerant added and the leak checks.
    h("Refrigerant added");
    const live = r.additions.filter((a) => !a.voided);
    if (live.length === 0) line("No refrigerant has been added.");
    for (const a of live) line(`${a.addedOn}: ${mass(a.amountKg)} by ${a.technician}: ${a.reason}`);
    h("Leak checks");
    if (r.leakChecks.length === 0) line("No leak check recorded.");
    for (const c of r.leakChecks)
      line(
        `${c.checkedOn}: ${c.leakFound ? "leak found" : "no leak found"}, by ${c.by}${c.note ? ` – ${c.note}` : ""}`,
      );
  }

  if (r.chronic.length) {
    h("Added per calendar year");
    for (const y of r.chronic) {
      const status = y.chronic
        ? y.filed
          ? `chronic leaker; report filed on ${y.filed.on} by ${y.filed.by}${y.filed.reference ? ` (reference ${y.filed.reference})` : ""}`
          : `chronic leaker; report due ${y.reportDue}`
        : "";
      line(
        `${y.year}: ${mass(y.addedKg)}, ${y.percent.toFixed(1)} % of the full charge${status ? ` — ${status}` : ""}.`,
      );
    }
    if (r.chronicRule)
      line(
        `Chronic leaker from ${r.chronicRule.percent} % of the full charge in a calendar year, reported by ${r.chronicRule.reportBy} (${readableSource(r.chronicRule.source)}).`,
      );
  }

  const voided = r.additions.filter((a) => a.voided);
  if (voided.length) {
    h("Corrected or voided entries (kept for the audit trail)");
    for (const a of voided)
      line(
        `${a.addedOn}: ${mass(a.amountKg)} by ${a.technician}, voided ${a.voided!.at.slice(0, 10)} by ${a.voided!.by}: ${a.voided!.reason}`,
      );
  }

  h("Findings");
  if (findingList.length === 0) line("No findings on this system.");
  for (const f of findingList) {
    doc
      .font("bold")
      .text(`${f.component ?? "Component not recorded"} – ${f.status}${f.dismissReason ? ` (${f.dismissReason})` : ""}`)
      .font("body");
    for (const e of f.events)
      line(`   ${e.on}  ${e.kind}${e.result ? ` (${e.result})` : ""}  signed ${e.by}${e.note ? ` – ${e.note}` : ""}`);
  }

  if (r.due.length) {
    h("Due");
    for (const d of r.due) line(`${d.dueOn ?? "no date"} (${d.state}): ${d.what}. Rule: ${readableSource(d.source)}`);
  }

  h("Record keeping");
  line(
    "“reading”: how the product applies a rule whose text it has not confirmed; every reading is listed once on the company's rule-profile page (Settings, Readings).",
  );
  line(
    `Keep these records for at least ${r.profile.retentionYears} years (${readableSource(r.profile.retentionSource)}).`,
  );
  line(
    r.profile.wording === "eu"
      ? "Only certified personnel check for leaks, recover, install or service equipment containing fluorinated gases (Regulation (EU) 2024/573). Local codes and licensed practice govern."
      : "Only certified technicians attach gauges or add or remove refrigerant (in the US, EPA Section 608). Local codes and licensed practice govern.",
  );
  doc.end();
  return done;
}
