import { desc, eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { ImageVariant, Plan } from "#core/contracts/plans";
import { plans } from "../../db/schema/index";
import { HttpError, notFound } from "../../lib/http-error";
import { loadVisibleStore, type Viewer } from "../../access/store-access";
import { fixtureCounts, loadVisiblePlan } from "../../access/plan-access";
import { uploadsStorage } from "../../storage/uploads-storage";
import { toPlan } from "../../db/plans/plan-rows";

/** Every version of the store's plan, newest first. */
export async function listPlans(ctx: AppContext, viewer: Viewer, storeId: string): Promise<Plan[]> {
  await loadVisibleStore(ctx, viewer, storeId);
  const rows = await ctx.db.select().from(plans).where(eq(plans.storeId, storeId)).orderBy(desc(plans.version));
  const counts = await fixtureCounts(
    ctx.db,
    rows.map((r) => r.id),
  );
  return rows.map((r) => toPlan(r, counts.get(r.id) ?? 0));
}

export async function getPlan(ctx: AppContext, viewer: Viewer, planId: string): Promise<Plan> {
  const row = await loadVisiblePlan(ctx, viewer, planId);
  const counts = await fixtureCounts(ctx.db, [row.id]);
  return toPlan(row, counts.get(row.id) ?? 0);
}

export async function readPlanImage(
  ctx: AppContext,
  viewer: Viewer,
  planId: string,
  variant: ImageVariant,
): Promise<{ mime: string; data: Buffer }> {
  const row = await loadVisiblePlan(ctx, viewer, planId);
  const key = variant === "original" ? row.originalKey : variant === "thumb" ? row.thumbKey : row.displayKey;
  if (row.source !== "image" || !key) throw new HttpError(404, "not_found", "A blank plan has no image.");
  const data = await uploadsStorage(ctx).get(key);
  if (!data) throw notFound("That plan image");
  return { mime: row.originalMime ?? "application/octet-stream", data };
}
