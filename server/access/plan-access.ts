import { and, count, eq, inArray } from "drizzle-orm";
import type { AppContext } from "../context";
import type { DbOrTx } from "../db/tx";
import { fixtures, plans } from "../db/schema/index";
import { conflict, HttpError, notFound } from "../lib/http-error";
import { loadVisibleStore, type Viewer } from "./store-access";
import type { PlanRow } from "../db/plans/plan-rows";
import { latestVersion } from "../db/plans/plan-versions";

/** The plan when the viewer may see its store; 404 otherwise (other companies' ids reveal nothing). */
export async function loadVisiblePlan(ctx: AppContext, viewer: Viewer, planId: string): Promise<PlanRow> {
  const [row] = await ctx.db
    .select()
    .from(plans)
    .where(and(eq(plans.id, planId), eq(plans.companyId, viewer.companyId)));
  if (!row) throw notFound("That plan");
  try {
    await loadVisibleStore(ctx, viewer, row.storeId);
  } catch (err) {
    // Only "not your store" becomes "not found"; a database outage stays a 503.
    if (err instanceof HttpError) throw notFound("That plan");
    throw err;
  }
  return row;
}

/** Locks the plan row for the rest of the transaction: saves on one plan run one at a time. */
export async function lockPlan(tx: DbOrTx, planId: string): Promise<PlanRow> {
  const [row] = await tx.select().from(plans).where(eq(plans.id, planId)).for("update");
  if (!row) throw notFound("That plan");
  return row;
}

/** Old versions keep what was drawn on them: only the store's newest version takes edits. */
export async function assertCurrentVersion(tx: DbOrTx, plan: PlanRow): Promise<void> {
  const latest = await latestVersion(tx, plan.storeId);
  if (latest && latest.id !== plan.id) {
    throw new HttpError(
      409,
      "old_plan_version",
      `This is plan version ${plan.version}; version ${latest.version} is the current one. Earlier versions stay as they were drawn — edit the current version.`,
      undefined,
      { currentPlanId: latest.id },
    );
  }
}

export function assertRevision(plan: PlanRow, layoutRevision: number | undefined): void {
  if (layoutRevision !== undefined && layoutRevision !== plan.layoutRevision) {
    throw new HttpError(
      409,
      "conflict",
      `The layout was changed by someone else since you opened it (you started from revision ${layoutRevision}; it is now at revision ${plan.layoutRevision}). Reload the layout, then make your change again — nothing was saved.`,
      undefined,
      { currentRevision: plan.layoutRevision },
    );
  }
}

export function assertCalibrated(plan: PlanRow): void {
  if (plan.widthM === null || plan.heightM === null) {
    throw conflict(
      "Calibrate the plan's scale first: draw a line of known length on the image. Fixtures are saved in metres, so an uncalibrated plan cannot hold them.",
    );
  }
}

export async function fixtureCounts(db: DbOrTx, planIds: string[]): Promise<Map<string, number>> {
  if (planIds.length === 0) return new Map();
  const rows = await db
    .select({ planId: fixtures.planId, n: count() })
    .from(fixtures)
    .where(inArray(fixtures.planId, planIds))
    .groupBy(fixtures.planId);
  return new Map(rows.map((r) => [r.planId, Number(r.n)]));
}
