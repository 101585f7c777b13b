import { eq, inArray } from "drizzle-orm";
import type { AppContext } from "../../context";
import {
  chargeAdditions,
  chronicLeakerReports,
  complianceAudit,
  findings,
  leakChecks,
  leakDetectionChecks,
} from "../../db/schema/index";

/** Every table whose rows are records of a system: a system any of them names is retired, never deleted. */
const RECORD_TABLES = [
  chargeAdditions,
  leakChecks,
  leakDetectionChecks,
  chronicLeakerReports,
  complianceAudit,
  findings,
];

/**
 * True when any record names the system: charge added, leak checks, checks of its leak detection
 * system, filings, audit rows or findings. Such a system is retired instead of deleted, and its
 * dated facts change only by revisions.
 */
export async function hasRecords(ctx: AppContext, systemId: string): Promise<boolean> {
  const found = await Promise.all(
    RECORD_TABLES.map((t) => ctx.db.select({ id: t.id }).from(t).where(eq(t.systemId, systemId)).limit(1)),
  );
  return found.some((rows) => rows.length > 0);
}

/** The ids among `systemIds` that some record names (one query per table, for a store's list). */
export async function systemsWithRecords(ctx: AppContext, systemIds: readonly string[]): Promise<Set<string>> {
  if (systemIds.length === 0) return new Set();
  const found = await Promise.all(
    RECORD_TABLES.map((t) =>
      ctx.db
        .selectDistinct({ systemId: t.systemId })
        .from(t)
        .where(inArray(t.systemId, [...systemIds])),
    ),
  );
  return new Set(found.flat().flatMap((r) => (r.systemId ? [r.systemId] : [])));
}
