import { eq } from "drizzle-orm";
import { sweeps } from "../../db/schema/index";
import type { DbOrTx } from "../../db/tx";

/**
 * Whether any sweep was drawn on this plan version. The one place that decides whether a
 * re-calibration may move fixtures in place (no sweeps) or must make a new version (sweeps
 * never move). Sweeps are started under a share lock on the plan row (sweeps.service.ts), so a
 * calibration holding the row for update sees every sweep that will ever exist on it.
 */
export async function planHasSweeps(db: DbOrTx, planId: string): Promise<boolean> {
  const [row] = await db.select({ id: sweeps.id }).from(sweeps).where(eq(sweeps.planId, planId)).limit(1);
  return row !== undefined;
}
