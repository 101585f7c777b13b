import { and, eq, inArray, sql } from "drizzle-orm";
import type { AppContext } from "../../context";
import { validateFixtureList, type FieldError, type Fixture } from "#core/contracts/fixtures";
import type { FixturesPutInput, FixturesResponse } from "#core/contracts/plans";
import { fixtures, plans, systems } from "../../db/schema/index";
import { describeFields } from "../../lib/zod-fields";
import { HttpError } from "../../lib/http-error";
import type { Viewer } from "../../access/store-access";
import {
  assertCalibrated,
  assertCurrentVersion,
  assertRevision,
  loadVisiblePlan,
  lockPlan,
} from "../../access/plan-access";
import type { DbOrTx } from "../../db/tx";
import { fixtureToRow, planBounds, rowToFixture, type PlanRow } from "../../db/plans/plan-rows";
import { insertFixtureRows, loadFixtureRows } from "../../db/plans/plan-versions";

function fieldErrors(errors: FieldError[]): never {
  const fields: Record<string, string> = {};
  for (const e of errors) if (!(e.path in fields)) fields[e.path] = e.message;
  throw new HttpError(400, "validation_failed", describeFields(fields), fields);
}

function respond(plan: PlanRow, list: Fixture[]): FixturesResponse {
  return { planId: plan.id, layoutRevision: plan.layoutRevision, bounds: planBounds(plan), fixtures: list };
}

export async function getFixtures(ctx: AppContext, viewer: Viewer, planId: string): Promise<FixturesResponse> {
  const plan = await loadVisiblePlan(ctx, viewer, planId);
  const rows = await loadFixtureRows(ctx.db, planId);
  return respond(plan, rows.map(rowToFixture));
}

/** A fixture may hang off a system of the same store only. */
async function checkSystems(tx: DbOrTx, plan: PlanRow, list: readonly Fixture[], root: string): Promise<void> {
  const ids = [...new Set(list.map((f) => f.systemId).filter((id): id is string => id !== null))];
  if (ids.length === 0) return;
  const found = await tx
    .select({ id: systems.id })
    .from(systems)
    .where(and(inArray(systems.id, ids), eq(systems.storeId, plan.storeId)));
  const known = new Set(found.map((r) => r.id));
  const errors: FieldError[] = [];
  list.forEach((f, i) => {
    if (f.systemId !== null && !known.has(f.systemId))
      errors.push({ path: `${root}.${i}.systemId`, message: "is not a system of this store" });
  });
  if (errors.length) fieldErrors(errors);
}

/** The checks every save makes under the plan's row lock, before anything is written. */
async function lockForSave(tx: DbOrTx, planId: string, layoutRevision: number): Promise<PlanRow> {
  const plan = await lockPlan(tx, planId);
  await assertCurrentVersion(tx, plan);
  assertCalibrated(plan);
  assertRevision(plan, layoutRevision);
  return plan;
}

async function writeAll(tx: DbOrTx, plan: PlanRow, list: Fixture[]): Promise<PlanRow> {
  await tx.delete(fixtures).where(eq(fixtures.planId, plan.id));
  await insertFixtureRows(
    tx,
    list.map((f, i) => fixtureToRow(plan.id, f, i)),
  );
  const [row] = await tx
    .update(plans)
    .set({ layoutRevision: sql`${plans.layoutRevision} + 1` })
    .where(eq(plans.id, plan.id))
    .returning();
  return row;
}

/** Replaces the whole set, if nobody saved since `layoutRevision`; otherwise 409 and nothing changes. */
export async function putFixtures(
  ctx: AppContext,
  viewer: Viewer,
  planId: string,
  input: FixturesPutInput,
): Promise<FixturesResponse> {
  await loadVisiblePlan(ctx, viewer, planId);
  return ctx.db.transaction(async (tx) => {
    const plan = await lockForSave(tx, planId, input.layoutRevision);
    const checked = validateFixtureList(input.fixtures, planBounds(plan)!, "fixtures");
    if (!checked.ok) fieldErrors(checked.errors);
    await checkSystems(tx, plan, checked.fixtures, "fixtures");
    const row = await writeAll(tx, plan, checked.fixtures);
    return respond(row, checked.fixtures);
  });
}
