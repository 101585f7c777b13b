/** The locator on the process's CPU pool: `run` resolves with the result or rejects with JobError. */
import type { LocatorResult } from "#core/contracts/locator-output";
import type { AnalysisJob } from "./analysis.worker";
import { createCpuRunner } from "./cpu-runner";

export function createAnalysisRunner() {
  return createCpuRunner<AnalysisJob, LocatorResult>("analysis");
}

export type AnalysisRunner = ReturnType<typeof createAnalysisRunner>;
