import { eq } from "drizzle-orm";
import { sweeps } from "../../db/schema/index";
import type { DbOrTx } from "./plan-access";

/**
 * Whether any sweep was drawn on this plan version. The one place that decides whether a
 * re-calibration may move fixtures in place (no sweeps) or must make a new version (sweeps
 * never move).
 */
export async function planHasSweeps(db: DbOrTx, planId: string): Promise<boolean> {
  const [row] = await db.select({ id: sweeps.id }).from(sweeps).where(eq(sweeps.planId, planId)).limit(1);
  return row !== undefined;
}
