import { queryOptions, useQuery } from "@tanstack/react-query";
import { readingsResponse } from "#core/contracts/compliance";
import { api } from "../../../lib/api-client";
import { complianceKeys } from "./compliance-keys";

export function getReadings(signal?: AbortSignal) {
  return api.get("/api/compliance/readings", readingsResponse, signal);
}

export function readingsQueryOptions() {
  return queryOptions({ queryKey: complianceKeys.readings(), queryFn: ({ signal }) => getReadings(signal) });
}

export function useReadings() {
  return useQuery(readingsQueryOptions());
}
