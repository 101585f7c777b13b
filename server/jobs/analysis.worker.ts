/** Runs the locator on the CPU pool (see analysis-runner.ts). */
import { locate, type LocatorOptions } from "#core/analysis/locate";
import { LocatorInputError, type LocatorInput } from "#core/contracts/locator-input";
import type { LocatorResult } from "#core/contracts/locator-output";
import { workerTask } from "./worker-task";

export interface AnalysisJob {
  input: LocatorInput;
  options?: Partial<LocatorOptions>;
}

export default workerTask<AnalysisJob, LocatorResult>((job) => locate(job.input, job.options), {
  transferables: (r) => [r.field.values.buffer as ArrayBuffer, r.field.confidence.buffer as ArrayBuffer],
  describeError: (err) =>
    err instanceof LocatorInputError
      ? { message: err.message, problems: err.problems }
      : { message: err instanceof Error ? err.message : String(err) },
});
