/** The report renderer behind a one-worker pool (reports are occasional; the locator keeps its own). */
import type { ReportJob } from "./report.worker";
import { createWorkerPool } from "./worker-pool";

export function createReportRunner(size = 1) {
  return createWorkerPool<ReportJob, Uint8Array>({ module: new URL("./report.worker.ts", import.meta.url), size });
}

export type ReportRunner = ReturnType<typeof createReportRunner>;
