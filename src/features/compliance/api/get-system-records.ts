import { queryOptions, useQuery } from "@tanstack/react-query";
import { systemRecords } from "#core/contracts/compliance";
import { api } from "../../../lib/api-client";
import { complianceKeys } from "./compliance-keys";

export function getSystemRecords(systemId: string, signal?: AbortSignal) {
  return api.get(`/api/systems/${systemId}/records`, systemRecords, signal);
}

export function systemRecordsQueryOptions(systemId: string) {
  return queryOptions({
    queryKey: complianceKeys.record(systemId),
    queryFn: ({ signal }) => getSystemRecords(systemId, signal),
  });
}

export function useSystemRecords(systemId: string) {
  return useQuery(systemRecordsQueryOptions(systemId));
}
