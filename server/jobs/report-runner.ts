/** The report renderer (field map + PDF) on the process's CPU pool. */
import type { ReportJob } from "./report.worker";
import { createCpuRunner } from "./cpu-runner";

export function createReportRunner() {
  return createCpuRunner<ReportJob, Uint8Array>("report");
}

export type ReportRunner = ReturnType<typeof createReportRunner>;
