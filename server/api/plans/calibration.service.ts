import { eq, sql } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { CalibrationInput, Plan } from "#core/contracts/plans";
import { toMetres } from "#core/analysis/geometry/units";
import { fixtures, plans } from "../../db/schema/index";
import { transformFixture } from "#core/domain/plans/transform-fixture";
import { badRequest, HttpError } from "../../lib/http-error";
import { PLAN_MAX_SIDE_M } from "#core/contracts/quantities";
import type { Viewer } from "../../access/store-access";
import {
  assertCurrentVersion,
  assertRevision,
  fixtureCounts,
  loadVisiblePlan,
  lockPlan,
} from "../../access/plan-access";
import type { DbOrTx } from "../../db/tx";
import { fixtureToRow, rowToFixture, toPlan, type PlanRow } from "../../db/plans/plan-rows";
import { planHasSweeps } from "./plan-sweeps";
import { addPlanVersion, insertFixtureRows, loadFixtureRows } from "../../db/plans/plan-versions";

/** A drawn line shorter than this is too imprecise to calibrate from (a few pixels of error). */
export const MIN_CALIBRATION_PIXELS = 10;

export type CalibrationOutcome = "first" | "rescaled" | "new-version";

/**
 * Metres per pixel of the display image from a line a→b of known real length. Feet convert at
 * exactly 0.3048 m (NIST SP 811), so a 10 ft line 200 px long gives 3.048 / 200 = 0.01524 m/px.
 */
export function metresPerPixel(
  input: Pick<CalibrationInput, "a" | "b" | "length">,
  image: { widthPx: number; heightPx: number },
): number {
  const fields: Record<string, string> = {};
  for (const end of ["a", "b"] as const) {
    const p = input[end];
    if (p.x < 0 || p.y < 0 || p.x > image.widthPx || p.y > image.heightPx) {
      fields[end] = `(${p.x}, ${p.y}) lies outside the ${image.widthPx} × ${image.heightPx} px image`;
    }
  }
  const pixels = Math.hypot(input.b.x - input.a.x, input.b.y - input.a.y);
  if (!fields.b && pixels < MIN_CALIBRATION_PIXELS) {
    fields.b = `is only ${pixels.toFixed(1)} px from a; draw the line at least ${MIN_CALIBRATION_PIXELS} px long, ideally along a long known wall`;
  }
  if (Object.keys(fields).length) throw badRequest("Please check the calibration line.", fields);
  const mpp = toMetres(input.length.value, input.length.unit) / pixels;
  const side = Math.max(image.widthPx, image.heightPx) * mpp;
  if (side > PLAN_MAX_SIDE_M)
    throw badRequest("Please check the calibration line.", {
      "length.value": `makes the plan ${Math.round(side).toLocaleString("en-US")} m across; a plan side may be at most ${PLAN_MAX_SIDE_M.toLocaleString("en-US")} m (is the unit right?)`,
    });
  return mpp;
}

async function rescaleInPlace(tx: DbOrTx, plan: PlanRow, factor: number): Promise<void> {
  const rows = await loadFixtureRows(tx, plan.id);
  if (rows.length === 0) return;
  const scaled = rows.map((r) =>
    fixtureToRow(plan.id, transformFixture(rowToFixture(r), { scale: factor, rotation: 0, tx: 0, ty: 0 }), r.position),
  );
  await tx.delete(fixtures).where(eq(fixtures.planId, plan.id));
  await insertFixtureRows(tx, scaled);
}

/**
 * The same drawing with a new scale as the store's next version, for a plan that has sweeps:
 * the sweeps stay on `plan` untouched; the fixtures are copied with their ids and rescaled, and
 * the alignment is exactly the scale change about the origin.
 */
export async function addRecalibratedVersion(
  tx: DbOrTx,
  plan: PlanRow,
  next: { metresPerPixel: number; calibration: NonNullable<PlanRow["calibration"]>; userId: string | null },
): Promise<PlanRow> {
  if (!plan.metresPerPixel || !plan.imageWidthPx || !plan.imageHeightPx)
    throw new Error("only a calibrated image plan can be re-calibrated into a new version");
  const factor = next.metresPerPixel / plan.metresPerPixel;
  return addPlanVersion(
    tx,
    {
      companyId: plan.companyId,
      storeId: plan.storeId,
      source: "image",
      originalKey: plan.originalKey,
      displayKey: plan.displayKey,
      thumbKey: plan.thumbKey,
      originalMime: plan.originalMime,
      originalWidthPx: plan.originalWidthPx,
      originalHeightPx: plan.originalHeightPx,
      imageWidthPx: plan.imageWidthPx,
      imageHeightPx: plan.imageHeightPx,
      metresPerPixel: next.metresPerPixel,
      calibration: next.calibration,
      widthM: plan.imageWidthPx * next.metresPerPixel,
      heightM: plan.imageHeightPx * next.metresPerPixel,
      createdById: next.userId,
    },
    { transform: { scale: factor, rotation: 0, tx: 0, ty: 0 }, alignmentKnown: true },
  );
}

/**
 * Stores a plan's scale. Fixtures were drawn over the image, so their pixel positions are what
 * the lead tech meant: with a new scale their metres change by new/old. Without sweeps the
 * fixtures are rescaled in place; with sweeps a new version is made and the old one (and its
 * sweeps) never moves.
 */
export async function calibratePlan(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  planId: string,
  input: CalibrationInput,
): Promise<{ plan: Plan; outcome: CalibrationOutcome }> {
  const visible = await loadVisiblePlan(ctx, viewer, planId);
  if (visible.source !== "image" || !visible.imageWidthPx || !visible.imageHeightPx) {
    throw new HttpError(
      409,
      "blank_plan",
      "A blank plan has no drawing to calibrate: it is sized in metres when it is made.",
    );
  }
  const mpp = metresPerPixel(input, { widthPx: visible.imageWidthPx, heightPx: visible.imageHeightPx });
  const calibration = { a: input.a, b: input.b, length: input.length };
  const extent = { widthM: visible.imageWidthPx * mpp, heightM: visible.imageHeightPx * mpp };

  const result = await ctx.db.transaction(async (tx) => {
    const plan = await lockPlan(tx, planId);
    assertRevision(plan, input.layoutRevision);
    if (plan.metresPerPixel === null) {
      const [row] = await tx
        .update(plans)
        .set({ metresPerPixel: mpp, calibration, ...extent, layoutRevision: sql`${plans.layoutRevision} + 1` })
        .where(eq(plans.id, plan.id))
        .returning();
      return { row, outcome: "first" as const };
    }
    const factor = mpp / plan.metresPerPixel;
    if (!(await planHasSweeps(tx, plan.id))) {
      await rescaleInPlace(tx, plan, factor);
      const [row] = await tx
        .update(plans)
        .set({ metresPerPixel: mpp, calibration, ...extent, layoutRevision: sql`${plans.layoutRevision} + 1` })
        .where(eq(plans.id, plan.id))
        .returning();
      return { row, outcome: "rescaled" as const };
    }
    await assertCurrentVersion(tx, plan);
    const row = await addRecalibratedVersion(tx, plan, { metresPerPixel: mpp, calibration, userId });
    return { row, outcome: "new-version" as const };
  });
  const counts = await fixtureCounts(ctx.db, [result.row.id]);
  return { plan: toPlan(result.row, counts.get(result.row.id) ?? 0), outcome: result.outcome };
}
