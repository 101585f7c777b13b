/**
 * The field map's analysis: the locator run off the event loop on a sweep's
 * readings and plan, cached per sweep and parameter set; a cached result whose readings changed since
 * is answered as stale while a recompute runs (or awaited with wait=true). With the job worker
 * running (every app process) a computation is a pg-boss job any process may run (decision 0085);
 * without it (API tests, tools) it runs here, as before.
 */
import { and, desc, eq, ne, notInArray } from "drizzle-orm";
import { can } from "#core/domain/roles";
import type { AppContext } from "../../context";
import type { AnalysisParams, AnalysisQuery, AnalysisResponse, AnalysisSummary } from "#core/contracts/analysis";
import { DEFAULT_CELL_SIZE_M, LocatorInputError, parseLocatorInput } from "#core/contracts/locator-input";
import { analyses, sweeps } from "../../db/schema/index";
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
/** Analysis jobs waiting or running at once across all processes; beyond it a new one is refused (429). */
export const ANALYSIS_BACKLOG_MAX = 8;
/** One try of an analysis job (2,000 readings take about 3 s; docs/benchmarks.md). */
export const ANALYSIS_TIME_LIMIT_S = 120;
/** How long a request that needs a fresh result (wait=true, a report) waits for its job. */
export const ANALYSIS_WAIT_MS = 60_000;
export const ANALYSIS_JOB = "analysis";

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
  const { sweep, readings, passes, plan, detectorName } = await loadAnalysisInputs(ctx, sweepId);
  const { input: raw, readingIds } = sweepLocatorInput(plan, sweep.startedAt, readings, params, passes);
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

const busy = (message: string) =>
  new HttpError(503, "busy", message, undefined, {
    retryAfterSeconds: 5,
  });

/** Queues the job for this sweep, parameter set and readings revision (joining one already waiting). */
async function queueAnalysis(ctx: AppContext, sweep: SweepRow, params: AnalysisParams): Promise<string | null> {
  const jobs = ctx.jobs!;
  if ((await jobs.backlog(ANALYSIS_JOB)) >= ANALYSIS_BACKLOG_MAX)
    throw new HttpError(429, "busy", "The server is computing other field maps; try again in a moment.", undefined, {
      retryAfterSeconds: 5,
    });
  return jobs.send(
    ANALYSIS_JOB,
    { companyId: sweep.companyId, sweepId: sweep.id, params, readingsRevision: sweep.readingsRevision },
    `${sweep.id}|${paramsKey(params)}|${sweep.readingsRevision}`,
  );
}

/**
 * A result for at least the sweep's current readings revision. Through the job queue: waits until
 * some process has stored it (polling the analyses row), or the job was refused or failed, bounded
 * by ANALYSIS_WAIT_MS; past that 503 with Retry-After, and the job goes on.
 */
async function freshAnalysis(ctx: AppContext, sweep: SweepRow, params: AnalysisParams): Promise<AnalysisRow> {
  if (!ctx.jobs?.running) return computeOnce(ctx, sweep, params);
  const jobId = await queueAnalysis(ctx, sweep, params);
  const deadline = Date.now() + ANALYSIS_WAIT_MS;
  for (let step = 50; ; step = Math.min(step * 2, 500)) {
    const row = await cachedAnalysis(ctx, sweep.id, params);
    if (row && row.readingsRevision >= sweep.readingsRevision) return row;
    const job = jobId ? await ctx.jobs.state(ANALYSIS_JOB, jobId) : null;
    if (job?.state === "completed" && job.reason) {
      const refused = job.reason.startsWith(REFUSED) ? (JSON.parse(job.reason.slice(REFUSED.length)) as string[]) : [];
      throw invalid(refused.length ? refused : [job.reason]);
    }
    if (job?.state === "failed")
      throw busy(`The field map could not be computed (${job.reason ?? "no reason given"}); try again later.`);
    if (Date.now() > deadline) throw busy("The field map is still being computed; it will be ready shortly.");
    await new Promise((r) => setTimeout(r, step));
  }
}

const REFUSED = "refused:";

/**
 * Runs one analysis job (any process). A sweep the locator refuses is not retried: the job completes
 * with the problems for the waiting request to answer field by field.
 */
export async function runAnalysisJob(
  ctx: AppContext,
  data: { sweepId: string; params: AnalysisParams },
): Promise<{ reason: string } | undefined> {
  const [sweep] = await ctx.db.select().from(sweeps).where(eq(sweeps.id, data.sweepId));
  if (!sweep) return; // deleted since it was queued
  const row = await cachedAnalysis(ctx, sweep.id, data.params);
  if (row && row.readingsRevision >= sweep.readingsRevision) return;
  try {
    await compute(ctx, sweep.id, data.params);
  } catch (err) {
    if (err instanceof HttpError && err.status === 400)
      return { reason: REFUSED + JSON.stringify(Object.entries(err.fields ?? {}).map(([k, v]) => `${k}: ${v}`)) };
    throw err;
  }
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
    const recompute = ctx.jobs?.running ? queueAnalysis(ctx, sweep, params) : computeOnce(ctx, sweep, params);
    recompute.catch((err) => ctx.logger.warn({ err, sweepId }, "analysis recompute failed"));
    return toResponse(ctx, row, sweep, true);
  }
  const fresh = await freshAnalysis(ctx, sweep, params);
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
  return freshAnalysis(ctx, sweep, params);
}
