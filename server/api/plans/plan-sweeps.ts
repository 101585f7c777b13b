import type { DbOrTx } from "./plan-access";

/**
 * Whether any sweep was drawn on this plan version. The one place that decides whether a
 * re-calibration may move fixtures in place (no sweeps) or must make a new version (sweeps
 * never move). There is no sweeps table yet: it arrives with issue 4 (sweeps in the field),
 * which must replace this body with a real query. Until then no plan can have sweeps.
 */
export async function planHasSweeps(_db: DbOrTx, _planId: string): Promise<boolean> {
  return false;
}
