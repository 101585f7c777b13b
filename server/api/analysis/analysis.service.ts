/**
 * The field map's analysis: the locator run off the event loop on a sweep's
 * readings and plan, cached per sweep and parameter set; a cached result whose readings changed since
 * is answered as stale while a recompute runs (or awaited with wait=true).
 */
import { and, desc, eq, ne, notInArray } from "drizzle-orm";
import { can } from "#core/domain/roles";
import type { AppContext } from "../../context";
import type { AnalysisParams, AnalysisQuery, AnalysisResponse, AnalysisSummary } from "#core/contracts/analysis";
import { DEFAULT_CELL_SIZE_M, LocatorInputError, parseLocatorInput } from "#core/contracts/locator-input";
import { analyses } from "../../db/schema/index";
import { detectorDiagnostics } from "#core/domain/fieldmap/detector-diagnostics";
import { bytesToFloat32, float32ToBytes, quantiseConfidence } from "#core/domain/fieldmap/field-codec";
import { sweepLocatorInput } from "#core/domain/fieldmap/sweep-locator-input";
import { HttpError } from "../../lib/http-error";
import { createAnalysisRunner, type AnalysisRunner } from "../../jobs/analysis-runner";
import { JobError } from "../../jobs/cpu-pool";
import type { Viewer } from "../../access/store-access";
import { loadVisibleSweep, type SweepRow } from "../../access/sweep-access";
import { loadAnalysisInputs, paramsKey } from "./analysis-inputs";
import { withRefrigerants } from "./spot-refrigerants";

export type AnalysisRow = typeof analyses.$inferSelect;

const inflight = new Map<string, Promise<AnalysisRow>>();

/** Computations waiting or running at once in this process; beyond it a new one is refused (429). */
export const ANALYSIS_INFLIGHT_MAX = 8;
/** Parameter sets stored per sweep; the oldest tried ones go first, the detector's own stays. */
export const ANALYSES_PER_SWEEP_MAX = 6;

export function analysisRunner(ctx: AppContext): AnalysisRunner {
  ctx.analysisRunner ??= createAnalysisRunner();
  return ctx.analysisRunner;
}

/** "readings[3].t: t must not be negative" → { "readings[3].t": "t must not be negative" } */
function problemFields(problems: readonly string[]): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const p of problems) {
    const at = p.indexOf(": ");
    const key = at > 0 ? p.slice(0, at) : "input";
    fields[key] = fields[key] ? `${fields[key]}; ${p.slice(at + 2)}` : p.slice(at + 2);
  }
  return fields;
}

function invalid(problems: readonly string[]): HttpError {
  return new HttpError(
    400,
    "validation_failed",
    `The sweep cannot be analysed: ${problems.join("; ")}`,
    problemFields(problems),
  );
}

export function sweepParams(
  sweep: SweepRow,
  q: Pick<AnalysisQuery, "transportDelayS" | "timeConstantS">,
): AnalysisParams {
  return {
    transportDelayS: q.transportDelayS ?? sweep.transportDelayS,
    timeConstantS: q.timeConstantS ?? sweep.timeConstantS,
    alarmPpm: sweep.alarmPpm,
    cellSize: DEFAULT_CELL_SIZE_M,
  };
}

async function compute(ctx: AppContext, sweepId: string, params: AnalysisParams): Promise<AnalysisRow> {
  const { sweep, readings, plan, detectorName } = await loadAnalysisInputs(ctx, sweepId);
  const { input: raw, readingIds } = sweepLocatorInput(plan, sweep.startedAt, readings, params);
  let input;
  try {
    input = parseLocatorInput(raw);
  } catch (err) {
    if (err instanceof LocatorInputError) throw invalid(err.problems);
    throw err;
  }
  const started = performance.now();
  let result;
  try {
    // a delay set by hand on the field map is used as given; otherwise the locator may take the delay the
    // readings clearly support (docs/locator/pipeline.md, "The delay checked")
    const delaySetByHand =
      params.transportDelayS !== sweep.transportDelayS || params.timeConstantS !== sweep.timeConstantS;
    result = await analysisRunner(ctx).run({
      input,
      options: { cellSize: params.cellSize, delayFromReadings: !delaySetByHand },
    });
  } catch (err) {
    if (err instanceof JobError && err.problems) throw invalid(err.problems);
    throw err;
  }
  const durationMs = Math.round(performance.now() - started);
  const overdue = sweep.warnings.find((w) => w.code === "detector-overdue")?.message ?? null;
  const summary: AnalysisSummary = {
    candidates: result.candidates,
    background: result.background,
    diagnostics: [
      ...detectorDiagnostics(
        {
          name: detectorName,
          transportDelayS: sweep.transportDelayS,
          timeConstantS: sweep.timeConstantS,
          alarmPpm: sweep.alarmPpm,
          overdueMessage: overdue,
        },
        params,
      ),
      ...result.diagnostics,
    ],
    assumptions: result.assumptions,
    readings: result.readings.map((r) => ({ ...r, readingId: readingIds[r.index] })),
    delay: result.delay,
  };
  const values = {
    companyId: sweep.companyId,
    sweepId: sweep.id,
    paramsKey: paramsKey(params),
    params,
    readingsRevision: sweep.readingsRevision,
    result: summary,
    fieldWidth: result.field.width,
    fieldHeight: result.field.height,
    cellSize: result.field.cellSize,
    fieldValues: Buffer.from(float32ToBytes(result.field.values)),
    fieldConfidence: Buffer.from(quantiseConfidence(result.field.confidence)),
    durationMs,
    computedAt: new Date(),
  };
  const [row] = await ctx.db
    .insert(analyses)
    .values(values)
    .onConflictDoUpdate({ target: [analyses.sweepId, analyses.paramsKey], set: { ...values } })
    .returning();
  await evictOldTries(ctx, sweep);
  return row;
}

/** Keeps ANALYSES_PER_SWEEP_MAX parameter sets of a sweep: the detector's own and the latest tried. */
async function evictOldTries(ctx: AppContext, sweep: SweepRow): Promise<void> {
  const own = paramsKey(sweepParams(sweep, {}));
  const keep = ctx.db
    .select({ id: analyses.id })
    .from(analyses)
    .where(and(eq(analyses.sweepId, sweep.id), ne(analyses.paramsKey, own)))
    .orderBy(desc(analyses.computedAt))
    .limit(ANALYSES_PER_SWEEP_MAX - 1);
  const kept = (await keep).map((r) => r.id);
  await ctx.db
    .delete(analyses)
    .where(
      and(
        eq(analyses.sweepId, sweep.id),
        ne(analyses.paramsKey, own),
        kept.length ? notInArray(analyses.id, kept) : undefined,
      ),
    );
}

/** One computation per sweep, parameter set and readings revision at a time. */
function computeOnce(ctx: AppContext, sweep: SweepRow, params: AnalysisParams): Promise<AnalysisRow> {
  const key = `${sweep.id}|${paramsKey(params)}|${sweep.readingsRevision}`;
  let p = inflight.get(key);
  if (!p && inflight.size >= ANALYSIS_INFLIGHT_MAX)
    return Promise.reject(
      new HttpError(429, "busy", "The server is computing other field maps; try again in a moment.", undefined, {
        retryAfterSeconds: 5,
      }),
    );
  if (!p) {
    p = compute(ctx, sweep.id, params).finally(() => inflight.delete(key));
    inflight.set(key, p);
  }
  return p;
}

async function toResponse(
  ctx: AppContext,
  row: AnalysisRow,
  sweep: SweepRow,
  recomputing: boolean,
): Promise<AnalysisResponse> {
  return {
    sweepId: row.sweepId,
    params: row.params,
    ...row.result,
    candidates: await withRefrigerants(ctx, sweep.planId, row.result.candidates),
    readingsRevision: row.readingsRevision,
    currentReadingsRevision: sweep.readingsRevision,
    stale: row.readingsRevision !== sweep.readingsRevision,
    recomputing,
    computedAt: row.computedAt.toISOString(),
    durationMs: row.durationMs,
    field: {
      width: row.fieldWidth,
      height: row.fieldHeight,
      cellSize: row.cellSize,
      values: row.fieldValues.toString("base64"),
      confidence: row.fieldConfidence.toString("base64"),
    },
  };
}

export async function cachedAnalysis(
  ctx: AppContext,
  sweepId: string,
  params: AnalysisParams,
): Promise<AnalysisRow | undefined> {
  const [row] = await ctx.db
    .select()
    .from(analyses)
    .where(and(eq(analyses.sweepId, sweepId), eq(analyses.paramsKey, paramsKey(params))));
  return row;
}

export async function getAnalysis(
  ctx: AppContext,
  viewer: Viewer,
  sweepId: string,
  q: AnalysisQuery,
): Promise<AnalysisResponse> {
  const sweep = await loadVisibleSweep(ctx, viewer, sweepId);
  const params = sweepParams(sweep, q);
  // Every other delay or time constant is a new computation and a stored row: only roles that tune
  // field maps may ask for one (core/domain/roles.ts, analyses.tune).
  const tuned = {
    ...(params.transportDelayS !== sweep.transportDelayS ? { transportDelayS: "other values" } : {}),
    ...(params.timeConstantS !== sweep.timeConstantS ? { timeConstantS: "other values" } : {}),
  };
  if (Object.keys(tuned).length && !can(viewer.role, "analyses.tune"))
    throw new HttpError(
      403,
      "forbidden",
      "Your role sees the field map at the detector's own settings; an engineer or lead tech can try others.",
      Object.fromEntries(Object.keys(tuned).map((k) => [k, "may be changed by owners, lead techs and engineers only"])),
    );
  const row = await cachedAnalysis(ctx, sweepId, params);
  if (row && row.readingsRevision === sweep.readingsRevision) return toResponse(ctx, row, sweep, false);
  if (row && q.wait !== "true") {
    // Show what we have, say it is stale, and recompute in the background; the client asks again.
    computeOnce(ctx, sweep, params).catch((err) => ctx.logger.warn({ err, sweepId }, "analysis recompute failed"));
    return toResponse(ctx, row, sweep, true);
  }
  const fresh = await computeOnce(ctx, sweep, params);
  return toResponse(
    ctx,
    fresh,
    { ...sweep, readingsRevision: Math.max(sweep.readingsRevision, fresh.readingsRevision) },
    false,
  );
}

/** The decoded grid of a stored analysis (for reports and comparisons on the server). */
export function rowField(row: AnalysisRow) {
  const conf = new Float32Array(row.fieldConfidence.length);
  for (let i = 0; i < conf.length; i++) conf[i] = row.fieldConfidence[i] / 255;
  return {
    width: row.fieldWidth,
    height: row.fieldHeight,
    cellSize: row.cellSize,
    values: bytesToFloat32(new Uint8Array(row.fieldValues)),
    confidence: conf,
  };
}

/** The fresh analysis at the sweep's own settings, computing it when needed (reports, compare). */
export async function ensureAnalysis(ctx: AppContext, sweep: SweepRow): Promise<AnalysisRow> {
  const params = sweepParams(sweep, {});
  const row = await cachedAnalysis(ctx, sweep.id, params);
  if (row && row.readingsRevision === sweep.readingsRevision) return row;
  return computeOnce(ctx, sweep, params);
}
