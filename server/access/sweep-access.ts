import { and, eq } from "drizzle-orm";
import type { AppContext } from "../context";
import { sweeps } from "../db/schema/index";
import { HttpError, notFound } from "../lib/http-error";
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
  } catch (err) {
    // Only "not your store" becomes "no such sweep"; a database outage stays what it is (503).
    if (err instanceof HttpError) throw notFound("That sweep");
    throw err;
  }
  return row;
}
