import { and, eq } from "drizzle-orm";
import type { AppContext } from "../context";
import { sweeps } from "../db/schema/index";
import { notFound } from "../lib/http-error";
import { loadVisibleStore, type Viewer } from "./store-access";

export type SweepRow = typeof sweeps.$inferSelect;

/** The sweep when the viewer may see its store; 404 otherwise (other companies' ids reveal nothing). */
export async function loadVisibleSweep(ctx: AppContext, viewer: Viewer, sweepId: string): Promise<SweepRow> {
  const [row] = await ctx.db
    .select()
    .from(sweeps)
    .where(and(eq(sweeps.id, sweepId), eq(sweeps.companyId, viewer.companyId)));
  if (!row) throw notFound("That sweep");
  try {
    await loadVisibleStore(ctx, viewer, row.storeId);
  } catch {
    throw notFound("That sweep");
  }
  return row;
}
