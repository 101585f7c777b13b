import { asc, eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { AnalysisParams } from "#core/contracts/analysis";
import { detectors, fixtures, plans, readings, sweepPasses, sweeps } from "../../db/schema/index";
import { toLocatorPlan } from "#core/domain/layout/to-locator-input";
import type { SweepPassConditions, SweepReadingRow } from "#core/domain/fieldmap/sweep-locator-input";
import { badRequest, notFound } from "../../lib/http-error";
import { planBounds, rowToFixture } from "../../db/plans/plan-rows";
import type { SweepRow } from "../../access/sweep-access";

export interface AnalysisInputs {
  sweep: SweepRow;
  readings: SweepReadingRow[];
  passes: SweepPassConditions[];
  plan: ReturnType<typeof toLocatorPlan>;
  detectorName: string;
}

/**
 * Version of the stored result's shape: results stored under another version are never read (their
 * keys differ), so a change to `analysisSummary` bumps it. 2: facts instead of sentences.
 */
const RESULT_VERSION = 2;

/** Canonical text of a parameter set: the cache key beside the sweep id. */
export function paramsKey(p: AnalysisParams): string {
  return `v${RESULT_VERSION};delay=${p.transportDelayS};tau=${p.timeConstantS};alarm=${p.alarmPpm};cell=${p.cellSize}`;
}

/**
 * The sweep's revision, its readings and its plan read in one repeatable-read transaction, so the
 * revision stored with the result is the one the readings belong to.
 */
export async function loadAnalysisInputs(ctx: AppContext, sweepId: string): Promise<AnalysisInputs> {
  return ctx.db.transaction(
    async (tx) => {
      const [sweep] = await tx.select().from(sweeps).where(eq(sweeps.id, sweepId));
      if (!sweep) throw notFound("That sweep");
      const rows = await tx
        .select({
          id: readings.id,
          x: readings.x,
          y: readings.y,
          takenAt: readings.takenAt,
          ppm: readings.ppm,
          atLeast: readings.atLeast,
          samplePoint: readings.samplePoint,
          note: readings.note,
          passId: readings.passId,
        })
        .from(readings)
        .where(eq(readings.sweepId, sweepId))
        .orderBy(asc(readings.takenAt), asc(readings.id));
      const [planRow] = await tx.select().from(plans).where(eq(plans.id, sweep.planId));
      const bounds = planRow ? planBounds(planRow) : null;
      if (!bounds)
        throw badRequest("The sweep's plan has no size in metres yet: calibrate it first.", {
          planId: "plan is not calibrated",
        });
      const fixtureRows = await tx
        .select()
        .from(fixtures)
        .where(eq(fixtures.planId, sweep.planId))
        .orderBy(asc(fixtures.position));
      const [det] = await tx.select({ name: detectors.name }).from(detectors).where(eq(detectors.id, sweep.detectorId));
      const plan = toLocatorPlan(bounds, fixtureRows.map(rowToFixture), { fansRunning: sweep.fans === "running" });
      const passes = await tx
        .select({
          id: sweepPasses.id,
          fans: sweepPasses.fans,
          defrost: sweepPasses.defrost,
          fixtureId: sweepPasses.fixtureId,
        })
        .from(sweepPasses)
        .where(eq(sweepPasses.sweepId, sweepId))
        .orderBy(asc(sweepPasses.startedAt));
      return { sweep, readings: rows, passes, plan, detectorName: det?.name ?? "The detector" };
    },
    { isolationLevel: "repeatable read", accessMode: "read only" },
  );
}
