/**
 * The kinds of background job every app process runs (server/jobs/job-queue.ts, decision 0085):
 * analyses, sent reports' PDFs (decision 0096), the hourly digest pass (a pg-boss cron schedule,
 * queued once across all processes) and one digest job per company, each with its retries and time limit.
 */
import { z } from "zod";
import type { AppContext } from "../context";
import { ANALYSIS_JOB, ANALYSIS_TIME_LIMIT_S, runAnalysisJob } from "../api/analysis/analysis.service";
import {
  REPORT_PDF_JOB,
  REPORT_PDF_SWEEP_JOB,
  REPORT_PDF_TIME_LIMIT_S,
  reportPdfGaveUp,
  runReportPdfJob,
  sweepPreparingReports,
} from "../api/reports/report-pdf-job";
import { companiesPastDigestHour, sendDigest } from "./digest";
import type { JobDefinition, JobQueue } from "./job-queue";

export const DIGEST_JOB = "digest";
export const DIGEST_PASS_JOB = "digest-pass";

// Jobs are written by our own code, but their rows outlive a deploy: read them with a schema.
const analysisData = z.object({
  sweepId: z.uuid(),
  params: z.object({
    transportDelayS: z.number(),
    timeConstantS: z.number(),
    alarmPpm: z.number(),
    cellSize: z.number(),
  }),
});
const digestData = z.object({ companyId: z.uuid() });
const reportPdfData = z.object({ sendId: z.uuid(), companyId: z.uuid() });

export function jobDefinitions(ctx: AppContext, jobs: JobQueue): Record<string, JobDefinition> {
  return {
    [ANALYSIS_JOB]: {
      retryLimit: 2,
      retryDelayS: 5,
      timeLimitS: ANALYSIS_TIME_LIMIT_S,
      policy: "short",
      run: (data) => runAnalysisJob(ctx, analysisData.parse(data)),
    },
    // A sent report's PDF; after the last try the send shows "failed" with the reason.
    [REPORT_PDF_JOB]: {
      retryLimit: 2,
      retryDelayS: 10,
      timeLimitS: REPORT_PDF_TIME_LIMIT_S,
      run: (data) => runReportPdfJob(ctx, reportPdfData.parse(data)),
      gaveUp: (data, reason) => reportPdfGaveUp(ctx, reportPdfData.parse(data), reason),
    },
    // Every minute, once across processes: sends whose PDF job was never handed over, or died for good.
    [REPORT_PDF_SWEEP_JOB]: {
      retryLimit: 0,
      retryDelayS: 60,
      timeLimitS: 60,
      policy: "short",
      cron: "* * * * *",
      run: () => sweepPreparingReports(ctx),
    },
    // Minute 5 of every hour (UTC), as the croner schedule before it; a company's digest goes out
    // at the first pass after 06:00 its local time, once a day (sendDigest's claim, decision 0010).
    [DIGEST_PASS_JOB]: {
      retryLimit: 2,
      retryDelayS: 60,
      timeLimitS: 120,
      policy: "short",
      cron: "5 * * * *",
      run: async () => {
        for (const companyId of await companiesPastDigestHour(ctx))
          await jobs.send(DIGEST_JOB, { companyId }, companyId);
      },
    },
    [DIGEST_JOB]: {
      retryLimit: 5,
      retryDelayS: 120,
      timeLimitS: 120,
      policy: "short",
      run: async (data) => {
        await sendDigest(ctx, digestData.parse(data).companyId, "schedule");
      },
    },
  };
}

/**
 * Starts the worker with every kind, and one digest pass now for a process started after the hour.
 * `digests: false` (the browser suite's server) leaves the digest schedule out; `retries` sets every
 * kind's retries (tests that watch a job fail for good); `work: false` queues jobs without taking any.
 */
export async function startJobs(
  ctx: AppContext,
  jobs: JobQueue,
  {
    digests = true,
    work = true,
    retries,
  }: { digests?: boolean; work?: boolean; retries?: { limit: number; delayS: number } } = {},
): Promise<void> {
  const all = jobDefinitions(ctx, jobs);
  if (retries)
    for (const def of Object.values(all))
      Object.assign(def, { retryLimit: retries.limit, retryDelayS: retries.delayS });
  if (!digests) {
    delete all[DIGEST_PASS_JOB];
    delete all[DIGEST_JOB];
  }
  await jobs.start(all, { work });
  ctx.jobs = jobs;
  if (digests) await jobs.send(DIGEST_PASS_JOB, {}, "start-up");
}
