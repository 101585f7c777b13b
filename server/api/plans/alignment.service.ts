import { eq, sql } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { AlignmentInput, Plan } from "#core/contracts/plans";
import {
  composeSimilarity,
  IDENTITY,
  invertSimilarity,
  similarityFromTwoPoints,
  type Similarity,
} from "#core/analysis/geometry/similarity";
import { fixtures, plans } from "../../db/schema/index";
import { transformFixture } from "#core/domain/plans/transform-fixture";
import { badRequest, HttpError } from "../../lib/http-error";
import { PLAN_MIN_LENGTH_M } from "#core/contracts/quantities";
import type { Viewer } from "../../access/store-access";
import {
  assertCalibrated,
  assertCurrentVersion,
  assertRevision,
  fixtureCounts,
  loadVisiblePlan,
  lockPlan,
} from "../../access/plan-access";
import { fixtureToRow, rowToFixture, toPlan } from "../../db/plans/plan-rows";
import { insertFixtureRows, loadFixtureRows } from "../../db/plans/plan-versions";

function fromTwoPoints(input: AlignmentInput): Similarity {
  const [p1, p2] = input.previous;
  const [c1, c2] = input.current;
  // Points closer than this cannot fix a scale and rotation (and nearly equal ones divide by ~0).
  const apart = (a: { x: number; y: number }, b: { x: number; y: number }) => Math.hypot(b.x - a.x, b.y - a.y);
  for (const [which, a, b] of [
    ["previous", p1, p2],
    ["current", c1, c2],
  ] as const)
    if (apart(a, b) < PLAN_MIN_LENGTH_M)
      throw badRequest("Please check the matched points.", {
        [`${which}.1`]: `is the same point as ${which}.0 (or within ${PLAN_MIN_LENGTH_M} m of it); pick two points far apart`,
      });
  const s = similarityFromTwoPoints([p1.x, p1.y], [p2.x, p2.y], [c1.x, c1.y], [c2.x, c2.y]);
  // Two drawings of one store differ in scale by a little, never by a hundred times.
  if (!(s.scale >= 0.01 && s.scale <= 100))
    throw badRequest("Please check the matched points.", {
      "current.1": `makes this version ${s.scale.toPrecision(3)} times the size of the previous one; match the same two corners on both`,
    });
  return s;
}

/**
 * Sets how this version lies over the previous one from two matched points (the same two
 * corners picked on both drawings). With moveFixtures, the copied fixtures move by the change
 * of alignment so they land on the new drawing; the previous version never changes.
 */
export async function setAlignment(
  ctx: AppContext,
  viewer: Viewer,
  planId: string,
  input: AlignmentInput,
): Promise<Plan> {
  await loadVisiblePlan(ctx, viewer, planId);
  const next = fromTwoPoints(input);
  const row = await ctx.db.transaction(async (tx) => {
    const plan = await lockPlan(tx, planId);
    if (!plan.previousPlanId)
      throw new HttpError(
        409,
        "no_previous_version",
        `Plan version ${plan.version} is the store's first; there is no earlier version to align it to.`,
      );
    await assertCurrentVersion(tx, plan);
    assertCalibrated(plan);
    assertRevision(plan, input.layoutRevision);
    if (input.moveFixtures) {
      // Fixtures sit where the old alignment put them: undo it, then apply the new one.
      const delta = composeSimilarity(invertSimilarity(plan.alignment ?? IDENTITY), next);
      const rows = await loadFixtureRows(tx, plan.id);
      if (rows.length) {
        await tx.delete(fixtures).where(eq(fixtures.planId, plan.id));
        await insertFixtureRows(
          tx,
          rows.map((r) => fixtureToRow(plan.id, transformFixture(rowToFixture(r), delta), r.position)),
        );
      }
    }
    const [updated] = await tx
      .update(plans)
      .set({ alignment: next, alignmentMatched: true, layoutRevision: sql`${plans.layoutRevision} + 1` })
      .where(eq(plans.id, plan.id))
      .returning();
    return updated;
  });
  const counts = await fixtureCounts(ctx.db, [row.id]);
  return toPlan(row, counts.get(row.id) ?? 0);
}
