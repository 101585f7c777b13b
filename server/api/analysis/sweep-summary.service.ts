/**
 * The store's last submitted sweeps for the store page's plot: peak ppm, suspect spots and findings
 * per sweep. Suspect spots come from an analysis already made at the sweep's own settings and
 * revision; nothing is computed here, so the store page never waits on the locator.
 */
import { and, count, desc, eq, inArray, max, ne, sql } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { SweepSummaryItem } from "#core/contracts/sweep-summary";
import { analyses, findings, readings, sweeps, users } from "../../db/schema/index";
import { loadVisibleStore, type Viewer } from "../../access/store-access";
import { sweepParams } from "./analysis.service";
import { paramsKey } from "./analysis-inputs";

export const SWEEP_SUMMARY_COUNT = 8;
const CONFIRMED_OR_LATER = new Set(["confirmed", "repaired", "verified", "closed"]);
// A finding closed because its system left service may never have been confirmed (docs/decisions/0166).
const everConfirmed = sql<boolean>`exists (select 1 from "finding_events" e where e."finding_id" = "findings"."id" and e."kind" = 'confirmed')`;

export async function sweepSummary(ctx: AppContext, viewer: Viewer, storeId: string): Promise<SweepSummaryItem[]> {
  await loadVisibleStore(ctx, viewer, storeId);
  const rows = await ctx.db
    .select({ sweep: sweeps, technicianName: users.name })
    .from(sweeps)
    .leftJoin(users, eq(users.id, sweeps.technicianId))
    .where(and(eq(sweeps.storeId, storeId), eq(sweeps.companyId, viewer.companyId), ne(sweeps.status, "in-progress")))
    .orderBy(desc(sweeps.startedAt))
    .limit(SWEEP_SUMMARY_COUNT);
  const ids = rows.map((r) => r.sweep.id);
  if (ids.length === 0) return [];
  const [peaks, findingRows, analysisRows] = await Promise.all([
    ctx.db
      .select({ sweepId: readings.sweepId, peak: max(readings.ppm), n: count() })
      .from(readings)
      .where(inArray(readings.sweepId, ids))
      .groupBy(readings.sweepId),
    ctx.db
      .select({ sweepId: findings.sweepId, status: findings.status, confirmed: everConfirmed, n: count() })
      .from(findings)
      .where(and(inArray(findings.sweepId, ids), eq(findings.companyId, viewer.companyId)))
      .groupBy(findings.sweepId, findings.status, everConfirmed),
    ctx.db
      .select({
        sweepId: analyses.sweepId,
        paramsKey: analyses.paramsKey,
        revision: analyses.readingsRevision,
        result: analyses.result,
      })
      .from(analyses)
      .where(inArray(analyses.sweepId, ids)),
  ]);
  const peakOf = new Map(peaks.map((p) => [p.sweepId, p]));
  const peggedAtPeak = await ctx.db
    .select({ sweepId: readings.sweepId, ppm: readings.ppm })
    .from(readings)
    .where(and(inArray(readings.sweepId, ids), eq(readings.atLeast, true)));
  return rows
    .map(({ sweep, technicianName }) => {
      const peak = peakOf.get(sweep.id);
      const own = paramsKey(sweepParams(sweep, {}));
      const analysis = analysisRows.find(
        (a) => a.sweepId === sweep.id && a.paramsKey === own && a.revision === sweep.readingsRevision,
      );
      const mine = findingRows.filter((f) => f.sweepId === sweep.id);
      return {
        id: sweep.id,
        startedAt: sweep.startedAt.toISOString(),
        technicianName: technicianName ?? "",
        readingCount: peak?.n ?? 0,
        peakPpm: peak?.peak ?? null,
        peakAtLeast: peggedAtPeak.some((p) => p.sweepId === sweep.id && peak?.peak != null && p.ppm >= peak.peak),
        suspects: analysis ? analysis.result.candidates.length : null,
        findings: mine.reduce((s, f) => s + f.n, 0),
        confirmed: mine
          .filter((f) => CONFIRMED_OR_LATER.has(f.status) && (f.status !== "closed" || f.confirmed))
          .reduce((s, f) => s + f.n, 0),
      };
    })
    .reverse();
}
