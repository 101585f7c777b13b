import { asc, eq, getTableColumns, inArray, type Table } from "drizzle-orm";
import type { AppContext } from "../../context";
import { companyRules } from "../compliance/system-records";
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
  rows: Record<string, unknown>[];
}

const cols = (t: Table) => Object.keys(getTableColumns(t));

/**
 * Every table of records a company owns, read with its company filter and nothing else, so the
 * archive is the record set itself rather than a view of it. Readings and finding steps reach
 * the company through their sweep and finding. Ordered by time so an auditor reads them in order.
 */
export async function archiveTables(ctx: AppContext, companyId: string): Promise<ArchiveTable[]> {
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
  const noChronicFile =
    filingRows.length === 0 && profileWording((await companyRules(ctx, companyId)).profile) === "eu";
  const tables: ArchiveTable[] = [
    { file: "stores.csv", columns: cols(stores), rows: storeRows },
    { file: "people.csv", columns: ["id", "name", "role"], rows: people },
    { file: "systems.csv", columns: cols(systems), rows: systemRows },
    { file: "system-revisions.csv", columns: cols(systemRevisions), rows: revisionRows },
    { file: "charge-added.csv", columns: cols(chargeAdditions), rows: additionRows },
    { file: "leak-checks.csv", columns: cols(leakChecks), rows: checkRows },
    // Checks of a system's leak detection system itself (EU, decision 0123).
    { file: "leak-detection-checks.csv", columns: cols(leakDetectionChecks), rows: ldsCheckRows },
    { file: "findings.csv", columns: cols(findings), rows: findingRows },
    // Repairs, verification tests (initial and follow-up) and closing are steps of a finding.
    { file: "finding-steps.csv", columns: cols(findingEvents), rows: stepRows },
    { file: "chronic-leaker-filings.csv", columns: cols(chronicLeakerReports), rows: filingRows },
    { file: "compliance-audit.csv", columns: cols(complianceAudit), rows: auditRows },
    { file: "rule-readings-accepted.csv", columns: cols(readingAcceptances), rows: acceptanceRows },
    { file: "rule-readings-withdrawn.csv", columns: cols(readingWithdrawals), rows: withdrawalRows },
    // A system's refrigerant_id "company:<id>" names a row here (entered by the company, decision 0073).
    { file: "company-refrigerants.csv", columns: cols(companyRefrigerants), rows: ownRefrigerantRows },
    { file: "sweeps.csv", columns: cols(sweeps), rows: sweepRows },
    { file: "readings.csv", columns: cols(readings), rows: readingRows },
    { file: "reading-edits.csv", columns: cols(readingAudit), rows: editRows },
  ];
  return noChronicFile ? tables.filter((x) => x.file !== "chronic-leaker-filings.csv") : tables;
}
