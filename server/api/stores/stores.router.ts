import { Router } from "express";
import { and, asc, eq, inArray } from "drizzle-orm";
import type { AppContext } from "../../context";
import { stores } from "../../db/schema/index";
import { isStoreScoped } from "../../domain/roles";
import { member, requireMember } from "../../middleware/auth";

export function storesRouter(ctx: AppContext): Router {
  const router = Router();

  router.get("/stores", requireMember("stores.read"), async (req, res) => {
    const m = member(req);
    const scope = isStoreScoped(m.role) ? inArray(stores.id, m.storeIds.length ? m.storeIds : ["00000000-0000-0000-0000-000000000000"]) : undefined;
    const rows = await ctx.db
      .select()
      .from(stores)
      .where(and(eq(stores.companyId, m.companyId), scope))
      .orderBy(asc(stores.name));
    res.json({
      stores: rows.map((s) => ({ id: s.id, name: s.name, address: s.address, timeZone: s.timeZone, archivedAt: s.archivedAt?.toISOString() ?? null })),
    });
  });

  return router;
}
