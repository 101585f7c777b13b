import { eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { SystemRemoval } from "#core/contracts/systems";
import { complianceAudit, systemRevisions, systems } from "../../db/schema/index";
import type { Viewer } from "../../access/store-access";
import { hasRecords } from "./system-has-records";
import { companyGwpBases, loadSystem, refuseRetired, toSystem } from "./systems.service";

const FOREIGN_KEY_VIOLATION = "23503";

function isForeignKeyViolation(e: unknown): boolean {
  const cause = (e as { cause?: { code?: string }; code?: string }) ?? {};
  return cause.code === FOREIGN_KEY_VIOLATION || cause.cause?.code === FOREIGN_KEY_VIOLATION;
}

/**
 * Removing a system (or retiring it on purpose, `alwaysRetire`): one without any record is deleted (fixtures linked to it lose the link); one
 * with records is retired instead, with an audit row, so every record and its audit trail stay for
 * the rule profile's retention period (docs/decisions/0040-no-record-is-lost.md). The records'
 * foreign keys restrict deletes, so a record written between the check and the delete also ends in
 * a retirement rather than a lost record.
 */
export async function removeSystem(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  systemId: string,
  how: { reason: string; alwaysRetire: boolean },
): Promise<SystemRemoval> {
  const { reason } = how;
  const row = await loadSystem(ctx, viewer, systemId);
  refuseRetired(row);
  if (!how.alwaysRetire && !(await hasRecords(ctx, systemId))) {
    try {
      await ctx.db.transaction(async (tx) => {
        await tx.delete(systemRevisions).where(eq(systemRevisions.systemId, systemId));
        await tx.delete(systems).where(eq(systems.id, systemId));
      });
      return { outcome: "deleted", system: null };
    } catch (e) {
      if (!isForeignKeyViolation(e)) throw e;
    }
  }
  const retired = await ctx.db.transaction(async (tx) => {
    const at = new Date();
    const [r] = await tx
      .update(systems)
      .set({ retiredAt: at, retiredById: userId, retireReason: reason, updatedAt: at })
      .where(eq(systems.id, systemId))
      .returning();
    await tx.insert(complianceAudit).values({
      companyId: viewer.companyId,
      systemId,
      action: "system-retired",
      byId: userId,
      summary: `${r.name} retired${reason ? `: ${reason}` : ""}; its records are kept`,
    });
    return r;
  });
  return { outcome: "retired", system: toSystem(retired, await companyGwpBases(ctx, viewer.companyId)) };
}
