/** The locator behind a worker pool: `run` resolves with the result or rejects with JobError. */
import type { LocatorResult } from "#core/contracts/locator-output";
import type { AnalysisJob } from "./analysis.worker";
import { createWorkerPool, defaultPoolSize } from "./worker-pool";
import { serverModule } from "../paths";

export function createAnalysisRunner(size = defaultPoolSize()) {
  return createWorkerPool<AnalysisJob, LocatorResult>({
    module: serverModule("jobs/analysis.worker"),
    size,
  });
}

export type AnalysisRunner = ReturnType<typeof createAnalysisRunner>;
