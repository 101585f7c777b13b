import { desc, eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import { plans } from "../../db/schema/index";
import type { Viewer } from "../../access/store-access";
import { loadVisibleStore } from "../../access/store-access";
import { toStore } from "./stores.service";
import { fixtureCounts } from "../../access/plan-access";
import { toPlan } from "../../db/plans/plan-rows";
import { listSystems } from "../systems/systems.service";

/** The store page: the store, its systems, the current plan and a summary of every plan version. */
export async function getStoreDetail(ctx: AppContext, viewer: Viewer, storeId: string) {
  const store = await loadVisibleStore(ctx, viewer, storeId);
  const [systemList, planRows] = await Promise.all([
    listSystems(ctx, viewer, storeId),
    ctx.db.select().from(plans).where(eq(plans.storeId, storeId)).orderBy(desc(plans.version)),
  ]);
  const counts = await fixtureCounts(
    ctx.db,
    planRows.map((p) => p.id),
  );
  const all = planRows.map((p) => toPlan(p, counts.get(p.id) ?? 0));
  return {
    store: toStore(store),
    systems: systemList,
    currentPlan: all[0] ?? null,
    planVersions: all.map((p) => ({
      id: p.id,
      version: p.version,
      source: p.source,
      calibrated: p.calibrated,
      fixtureCount: p.fixtureCount,
      createdAt: p.createdAt,
    })),
  };
}
