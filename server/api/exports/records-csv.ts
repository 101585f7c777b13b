import { unparseCsv } from "#core/domain/reports/csv-cells";
import type { SystemRecordsView } from "#core/contracts/compliance";
import type { FindingDetail } from "#core/contracts/finding-actions";
import { kgToPounds } from "#core/domain/units/mass";
import { readableSource } from "#core/domain/compliance/citations";
import { readableAuditEntry } from "#core/domain/compliance/audit-entry";
import { revisionHistory, type RevisionRow } from "#core/domain/compliance/revision-changes";
import { formatInZone } from "#core/domain/dates/format-in-zone";
import { localDateOf } from "#core/domain/dates/time-zone";
import { retireReasonWords } from "#core/domain/compliance/retirement-words";

/** The columns of a row before the GWP columns, in order: every kind of row has each of them. */
const COLUMNS = [
  "record",
  "date",
  "system",
  "refrigerant",
  "amount_kg",
  "amount_lb",
  "entered",
  "technician",
  "reason",
  "excluded",
  "leak_rate_percent",
  "method",
  "threshold_percent",
  "threshold_rule",
  "exceeds",
  "repair_due",
  "finding_id",
  "corrects",
  "voided",
  "status",
  "component",
  "recorded_by",
  "recorded_at",
  "recorded_at_utc",
  "entry_id",
  // Filled on system revisions only: the values in force from the row's date (docs/decisions/0126).
  "full_charge_kg",
  "full_charge_lb",
  "appliance_type",
  "automatic_leak_detection",
  "in_service_on",
  "changed",
] as const;
const blank: Record<(typeof COLUMNS)[number], string> = Object.fromEntries(COLUMNS.map((c) => [c, ""])) as never;

/**
 * One CSV of a system's records: every charge-added entry (voided ones too, with who voided them
 * and why: the audit trail) with the leak rate computed at it, every finding step and every
 * chronic-leaker report marked filed, and the system's audit trail. `recorded_at` is the moment on the
 * store's clock as a person reads it, `recorded_at_utc` the stored instant. Free text that begins like a formula (=, +, -, @, tab, CR) is
 * written with a leading ' so a spreadsheet shows it as text (OWASP CSV injection guidance).
 */
export function recordsCsv(
  r: SystemRecordsView,
  findingList: FindingDetail[],
  massFirst: "kg" | "lb",
  revisions: readonly RevisionRow[],
): string {
  const refrigerant = refrigerantCell(r.system.refrigerant);
  // A person reads the moment on the store's clock, zone named; the instant stays in recorded_at_utc.
  const storeTime = (at: string) => formatInZone(at, r.store.timeZone, "dateTime");
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
      voided: a.voided ? `${storeTime(a.voided.at)} by ${a.voided.by}: ${a.voided.reason}` : "",
      status: "",
      component: "",
      recorded_by: a.recordedBy,
      recorded_at: storeTime(a.recordedAt),
      recorded_at_utc: a.recordedAt,
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
        recorded_at: storeTime(e.at),
        recorded_at_utc: e.at,
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
      recorded_at: storeTime(y.filed.recordedAt),
      recorded_at_utc: y.filed.recordedAt,
      entry_id: "",
    });
  }
  // The system's dated revisions: why a figure uses the charge it uses.
  const kgAndLb = (kg: number) => {
    const [metric, pounds] = [`${Number(kg.toFixed(4))} kg`, `${Number(kgToPounds(kg).toFixed(3))} lb`];
    return massFirst === "lb" ? `${pounds} (${metric})` : `${metric} (${pounds})`;
  };
  for (const { revision: v, changes } of revisionHistory(revisions, kgAndLb)) {
    rows.push({
      ...blank,
      record: `system revision: ${v.kind}`,
      date: v.effectiveFrom,
      system: r.system.name,
      refrigerant: v.refrigerantName,
      technician: v.by,
      reason: v.reason,
      recorded_by: v.by,
      recorded_at: storeTime(v.recordedAt),
      recorded_at_utc: v.recordedAt,
      entry_id: v.id,
      full_charge_kg: Number(v.fullChargeKg.toFixed(4)),
      full_charge_lb: Number(kgToPounds(v.fullChargeKg).toFixed(3)),
      appliance_type: v.applianceType,
      automatic_leak_detection: v.automaticLeakDetection ? "yes" : "no",
      in_service_on: v.inServiceOn,
      changed: changes,
    });
  }
  // The audit trail of the system: each row's day and time on the store's clock, its instant in UTC.
  for (const a of r.audit) {
    const e = readableAuditEntry(a, r.store.timeZone);
    rows.push({
      ...blank,
      record: `audit trail: ${a.action}`,
      date: localDateOf(new Date(a.at), r.store.timeZone),
      system: r.system.name,
      refrigerant,
      technician: a.by,
      reason: e.summary,
      recorded_by: a.by,
      recorded_at: e.when,
      recorded_at_utc: a.at,
    });
  }
  // Checks of its leak detection system and its retirement (decisions 0123, 0124).
  rows.push(...systemFactRows(r, refrigerant, [...COLUMNS]));
  rows.sort((x, y) => String(x.date).localeCompare(String(y.date)));
  // The GWP, its stated basis and the charge's CO2-equivalent on every row, beside the figures.
  const gwp = r.system.refrigerant.gwp;
  const withBasis = rows.map((row) => ({
    ...blank,
    ...row,
    gwp: gwp?.value ?? "",
    gwp_basis: gwp?.statement ?? "",
    co2e_tonnes: r.co2e.known && r.co2e.tonnes !== null ? Math.round(r.co2e.tonnes * 1000) / 1000 : "",
    hermetically_sealed: r.system.hermeticallySealed ? "yes" : "no",
  }));
  // An lb company reads lb first (amount_lb before amount_kg); the columns are the same either way.
  const keys = Object.keys(withBasis[0] ?? {}); // COLUMNS, then the GWP columns
  const lbFirst: Record<string, string> = {
    amount_kg: "amount_lb",
    amount_lb: "amount_kg",
    full_charge_kg: "full_charge_lb",
    full_charge_lb: "full_charge_kg",
  };
  const fields = massFirst === "lb" ? keys.map((k) => lbFirst[k] ?? k) : keys;
  // Text cells escaped against formula injection (core/domain/reports/csv-cells.ts); numbers stay numbers.
  return withBasis.length > 0 ? unparseCsv({ fields, data: withBasis }) : unparseCsv(withBasis);
}

/** The designation, and for a company's own refrigerant that the company entered it (decision 0073). */
export function refrigerantCell(r: { designation: string; enteredByCompany: boolean }): string {
  return r.enteredByCompany ? `${r.designation} (entered by the company)` : r.designation;
}

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
      recorded_at: formatInZone(r.system.retired.at, r.store.timeZone, "dateTime"),
      recorded_at_utc: r.system.retired.at,
    });
  return rows;
}
