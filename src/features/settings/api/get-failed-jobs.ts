import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { failedJob } from "#core/contracts/jobs";
import { api } from "../../../lib/api-client";
import { settingsKeys } from "./settings-keys";

const failedJobsResponse = z.object({ jobs: z.array(failedJob) });

export function getFailedJobs(signal?: AbortSignal) {
  return api.get("/api/jobs/failed", failedJobsResponse, signal);
}

/** The company's background jobs that gave up after their retries (owners only). */
export function useFailedJobs() {
  return useQuery(
    queryOptions({ queryKey: settingsKeys.failedJobs(), queryFn: ({ signal }) => getFailedJobs(signal) }),
  );
}
