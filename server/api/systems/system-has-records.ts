import { eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import { chargeAdditions, chronicLeakerReports, complianceAudit, findings, leakChecks } from "../../db/schema/index";

/**
 * True when any record names the system: charge added, leak checks, filings, audit rows or findings.
 * Such a system is retired instead of deleted, and its dated facts change only by revisions.
 */
export async function hasRecords(ctx: AppContext, systemId: string): Promise<boolean> {
  const found = await Promise.all(
    [chargeAdditions, leakChecks, chronicLeakerReports, complianceAudit, findings].map((t) =>
      ctx.db.select({ id: t.id }).from(t).where(eq(t.systemId, systemId)).limit(1),
    ),
  );
  return found.some((rows) => rows.length > 0);
}
