import { unparseCsv } from "#core/domain/reports/csv-cells";
import type { SystemRecordsView } from "#core/contracts/compliance";
import type { FindingDetail } from "#core/contracts/finding-actions";
import { kgToPounds } from "#core/domain/units/mass";
import { readableSource } from "#core/domain/compliance/citations";
import { retireReasonWords } from "#core/domain/compliance/retirement-words";

/**
 * One CSV of a system's records: every charge-added entry (voided ones too, with who voided them
 * and why: the audit trail) with the leak rate computed at it, every finding step and every
 * chronic-leaker report marked filed. Free text that begins like a formula (=, +, -, @, tab, CR) is
 * written with a leading ' so a spreadsheet shows it as text (OWASP CSV injection guidance).
 */
export function recordsCsv(r: SystemRecordsView, findingList: FindingDetail[], massFirst: "kg" | "lb" = "kg"): string {
  const refrigerant = refrigerantCell(r.system.refrigerant);
  const rateAt = new Map(r.leakRates.flatMap((p) => p.additionIds.map((id) => [id, p] as const)));
  const rows: Record<string, string | number>[] = [];
  for (const a of r.additions) {
    const p = rateAt.get(a.id);
    rows.push({
      record: "charge added",
      date: a.addedOn,
      system: r.system.name,
      refrigerant,
      amount_kg: Number(a.amountKg.toFixed(4)),
      amount_lb: Number(kgToPounds(a.amountKg).toFixed(3)),
      entered: `${a.enteredValue} ${a.enteredUnit}`,
      technician: a.technician,
      reason: a.reason,
      excluded: a.excluded ?? "",
      leak_rate_percent: p ? Number(p.percent.toFixed(2)) : "",
      method: p ? p.method : "",
      threshold_percent: p?.thresholdPercent ?? "",
      threshold_rule: p?.thresholdSource ? readableSource(p.thresholdSource) : "",
      exceeds: p ? (p.exceeds ? "yes" : "no") : "",
      repair_due: p?.repairDue ?? "",
      finding_id: a.findingId ?? "",
      corrects: a.correctsId ?? "",
      voided: a.voided ? `${a.voided.at} by ${a.voided.by}: ${a.voided.reason}` : "",
      status: "",
      component: "",
      recorded_by: a.recordedBy,
      recorded_at: a.recordedAt,
      entry_id: a.id,
    });
  }
  for (const f of findingList) {
    for (const e of f.events) {
      rows.push({
        record: `finding ${e.kind}${e.result ? ` (${e.result})` : ""}`,
        date: e.on,
        system: r.system.name,
        refrigerant,
        amount_kg: "",
        amount_lb: "",
        entered: "",
        technician: e.by,
        reason: e.note,
        excluded: "",
        leak_rate_percent: "",
        method: "",
        threshold_percent: "",
        threshold_rule: "",
        exceeds: "",
        repair_due: "",
        finding_id: f.id,
        corrects: "",
        voided: "",
        status: e.status,
        component: f.component ?? "",
        recorded_by: e.by,
        recorded_at: e.at,
        entry_id: e.id,
      });
    }
  }
  for (const y of r.chronic) {
    if (!y.filed) continue;
    rows.push({
      record: `chronic-leaker report for ${y.year} filed`,
      date: y.filed.on,
      system: r.system.name,
      refrigerant,
      amount_kg: Number(y.addedKg.toFixed(4)),
      amount_lb: Number(kgToPounds(y.addedKg).toFixed(3)),
      entered: "",
      technician: y.filed.by,
      reason: y.filed.reference ? `reference ${y.filed.reference}` : y.filed.note,
      excluded: "",
      leak_rate_percent: "",
      method: "",
      threshold_percent: "",
      threshold_rule: "",
      exceeds: "",
      repair_due: "",
      finding_id: "",
      corrects: "",
      voided: "",
      status: "",
      component: "",
      recorded_by: y.filed.by,
      recorded_at: y.filed.recordedAt,
      entry_id: "",
    });
  }
  rows.push(...systemFactRows(r, refrigerant, Object.keys(rows[0] ?? BLANK_ROW)));
  rows.sort((x, y) => String(x.date).localeCompare(String(y.date)));
  // The GWP, its stated basis and the charge's CO2-equivalent on every row, beside the figures.
  const gwp = r.system.refrigerant.gwp;
  const withBasis = rows.map((row) => ({
    ...row,
    gwp: gwp?.value ?? "",
    gwp_basis: gwp?.statement ?? "",
    co2e_tonnes: r.co2e.known && r.co2e.tonnes !== null ? Math.round(r.co2e.tonnes * 1000) / 1000 : "",
    hermetically_sealed: r.system.hermeticallySealed ? "yes" : "no",
  }));
  // An lb company reads lb first (amount_lb before amount_kg); the columns are the same either way.
  const keys = Object.keys(withBasis[0] ?? {});
  const fields =
    massFirst === "lb"
      ? keys.map((k) => (k === "amount_kg" ? "amount_lb" : k === "amount_lb" ? "amount_kg" : k))
      : keys;
  // Text cells escaped against formula injection (core/domain/reports/csv-cells.ts); numbers stay numbers.
  return withBasis.length > 0 ? unparseCsv({ fields, data: withBasis }) : unparseCsv(withBasis);
}

/** The designation, and for a company's own refrigerant that the company entered it (decision 0073). */
export function refrigerantCell(r: { designation: string; enteredByCompany: boolean }): string {
  return r.enteredByCompany ? `${r.designation} (entered by the company)` : r.designation;
}

/** The columns every row of the records CSV has, in order (a system with no other record still gets its rows). */
const BLANK_ROW: Record<string, string> = Object.fromEntries(
  "record date system refrigerant amount_kg amount_lb entered technician reason excluded leak_rate_percent method threshold_percent threshold_rule exceeds repair_due finding_id corrects voided status component recorded_by recorded_at entry_id"
    .split(" ")
    .map((k) => [k, ""]),
);

/**
 * The records of the system itself: each check of its leak detection system (decision 0123) and
 * its retirement with the day and reason (decision 0124), as rows of the same columns.
 */
function systemFactRows(r: SystemRecordsView, refrigerant: string, keys: string[]): Record<string, string | number>[] {
  const blank = Object.fromEntries(keys.map((k) => [k, ""]));
  const rows: Record<string, string | number>[] = r.leakDetectionChecks.map((c) => ({
    ...blank,
    record: `leak detection system check (${c.working ? "working" : "fault found"})`,
    date: c.checkedOn,
    system: r.system.name,
    refrigerant,
    technician: c.by,
    reason: c.note,
    recorded_by: c.by,
    entry_id: c.id,
  }));
  if (r.system.retired)
    rows.push({
      ...blank,
      record: "system retired",
      date: r.system.retired.on,
      system: r.system.name,
      refrigerant,
      reason: retireReasonWords(r.system.retired),
      recorded_at: r.system.retired.at,
    });
  return rows;
}
