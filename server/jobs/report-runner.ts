/** The report renderer behind a one-worker pool (reports are occasional; the locator keeps its own). */
import type { ReportJob } from "./report.worker";
import { createWorkerPool } from "./worker-pool";
import { serverModule } from "../paths";

export function createReportRunner(size = 1) {
  return createWorkerPool<ReportJob, Uint8Array>({ module: serverModule("jobs/report.worker"), size });
}

export type ReportRunner = ReturnType<typeof createReportRunner>;
