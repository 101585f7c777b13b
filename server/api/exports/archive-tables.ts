import { asc, eq, getTableColumns, inArray, type Table } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { RuleProfile } from "#core/domain/compliance/rule-profile";
import { profileWording } from "#core/domain/compliance/company-profile";
import {
  chargeAdditions,
  chronicLeakerReports,
  complianceAudit,
  findingEvents,
  findings,
  leakChecks,
  leakDetectionChecks,
  memberships,
  readingAcceptances,
  readingWithdrawals,
  companyRefrigerants,
  readingAudit,
  readings,
  stores,
  sweeps,
  systemRevisions,
  systems,
  users,
} from "../../db/schema/index";

/** One CSV of the owner's archive: its file name and its rows as the database holds them. */
export interface ArchiveTable {
  file: string;
  /** Column names in order (camelCase, as in the schema); an empty table still has its header. */
  columns: string[];
  /** The columns holding instants (timestamps): their header says they are UTC ("recorded_at_utc"). */
  instants: string[];
  rows: Record<string, unknown>[];
}

const cols = (t: Table) => Object.keys(getTableColumns(t));
const instantsOf = (t: Table) =>
  Object.entries(getTableColumns(t))
    .filter(([, c]) => c.columnType === "PgTimestamp")
    .map(([name]) => name);
/** A table of the archive: its columns and which of them are instants come from the schema. */
const table = (file: string, t: Table, rows: Record<string, unknown>[]): ArchiveTable => ({
  file,
  columns: cols(t),
  instants: instantsOf(t),
  rows,
});

/**
 * Every table of records a company owns, read with its company filter and nothing else, so the
 * archive is the record set itself rather than a view of it. Readings and finding steps reach
 * the company through their sweep and finding. Ordered by time so an auditor reads them in order.
 */
export async function archiveTables(ctx: AppContext, companyId: string, profile: RuleProfile): Promise<ArchiveTable[]> {
  const db = ctx.db;
  const companySweeps = db.select({ id: sweeps.id }).from(sweeps).where(eq(sweeps.companyId, companyId));
  const companyFindings = db.select({ id: findings.id }).from(findings).where(eq(findings.companyId, companyId));
  const [
    storeRows,
    people,
    systemRows,
    revisionRows,
    additionRows,
    checkRows,
    findingRows,
    stepRows,
    filingRows,
    auditRows,
    sweepRows,
    readingRows,
    editRows,
    acceptanceRows,
    withdrawalRows,
    ownRefrigerantRows,
    ldsCheckRows,
  ] = await Promise.all([
    db.select().from(stores).where(eq(stores.companyId, companyId)).orderBy(asc(stores.createdAt), asc(stores.id)),
    db
      .select({ id: users.id, name: users.name, role: memberships.role })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.companyId, companyId))
      .orderBy(asc(users.name), asc(users.id)),
    db.select().from(systems).where(eq(systems.companyId, companyId)).orderBy(asc(systems.createdAt), asc(systems.id)),
    db
      .select()
      .from(systemRevisions)
      .where(eq(systemRevisions.companyId, companyId))
      .orderBy(asc(systemRevisions.effectiveFrom), asc(systemRevisions.recordedAt), asc(systemRevisions.id)),
    db
      .select()
      .from(chargeAdditions)
      .where(eq(chargeAdditions.companyId, companyId))
      .orderBy(asc(chargeAdditions.addedOn), asc(chargeAdditions.recordedAt), asc(chargeAdditions.id)),
    db
      .select()
      .from(leakChecks)
      .where(eq(leakChecks.companyId, companyId))
      .orderBy(asc(leakChecks.checkedOn), asc(leakChecks.recordedAt), asc(leakChecks.id)),
    db
      .select()
      .from(findings)
      .where(eq(findings.companyId, companyId))
      .orderBy(asc(findings.foundAt), asc(findings.id)),
    db
      .select()
      .from(findingEvents)
      .where(inArray(findingEvents.findingId, companyFindings))
      .orderBy(asc(findingEvents.at), asc(findingEvents.id)),
    db
      .select()
      .from(chronicLeakerReports)
      .where(eq(chronicLeakerReports.companyId, companyId))
      .orderBy(asc(chronicLeakerReports.year), asc(chronicLeakerReports.id)),
    db
      .select()
      .from(complianceAudit)
      .where(eq(complianceAudit.companyId, companyId))
      .orderBy(asc(complianceAudit.at), asc(complianceAudit.id)),
    db.select().from(sweeps).where(eq(sweeps.companyId, companyId)).orderBy(asc(sweeps.startedAt), asc(sweeps.id)),
    db
      .select()
      .from(readings)
      .where(inArray(readings.sweepId, companySweeps))
      .orderBy(asc(readings.sweepId), asc(readings.takenAt), asc(readings.id)),
    db.select().from(readingAudit).where(inArray(readingAudit.sweepId, companySweeps)).orderBy(asc(readingAudit.id)),
    db
      .select()
      .from(readingAcceptances)
      .where(eq(readingAcceptances.companyId, companyId))
      .orderBy(asc(readingAcceptances.at), asc(readingAcceptances.id)),
    db
      .select()
      .from(readingWithdrawals)
      .where(eq(readingWithdrawals.companyId, companyId))
      .orderBy(asc(readingWithdrawals.at), asc(readingWithdrawals.id)),
    db
      .select()
      .from(companyRefrigerants)
      .where(eq(companyRefrigerants.companyId, companyId))
      .orderBy(asc(companyRefrigerants.enteredAt), asc(companyRefrigerants.id)),
    db
      .select()
      .from(leakDetectionChecks)
      .where(eq(leakDetectionChecks.companyId, companyId))
      .orderBy(asc(leakDetectionChecks.checkedOn), asc(leakDetectionChecks.recordedAt), asc(leakDetectionChecks.id)),
  ]);
  // No chronic-leaker report exists under EU F-gas rules: an EU company's archive has no such file,
  // unless it holds filings from a time under US rules.
  const noChronicFile = filingRows.length === 0 && profileWording(profile) === "eu";
  const tables: ArchiveTable[] = [
    table("stores.csv", stores, storeRows),
    { file: "people.csv", columns: ["id", "name", "role"], instants: [], rows: people },
    table("systems.csv", systems, systemRows),
    table("system-revisions.csv", systemRevisions, revisionRows),
    table("charge-added.csv", chargeAdditions, additionRows),
    table("leak-checks.csv", leakChecks, checkRows),
    // Checks of a system's leak detection system itself (EU, decision 0123).
    table("leak-detection-checks.csv", leakDetectionChecks, ldsCheckRows),
    table("findings.csv", findings, findingRows),
    // Repairs, verification tests (initial and follow-up) and closing are steps of a finding.
    table("finding-steps.csv", findingEvents, stepRows),
    table("chronic-leaker-filings.csv", chronicLeakerReports, filingRows),
    table("compliance-audit.csv", complianceAudit, auditRows),
    table("rule-readings-accepted.csv", readingAcceptances, acceptanceRows),
    table("rule-readings-withdrawn.csv", readingWithdrawals, withdrawalRows),
    // A system's refrigerant_id "company:<id>" names a row here (entered by the company, decision 0073).
    table("company-refrigerants.csv", companyRefrigerants, ownRefrigerantRows),
    table("sweeps.csv", sweeps, sweepRows),
    table("readings.csv", readings, readingRows),
    table("reading-edits.csv", readingAudit, editRows),
  ];
  return noChronicFile ? tables.filter((x) => x.file !== "chronic-leaker-filings.csv") : tables;
}
