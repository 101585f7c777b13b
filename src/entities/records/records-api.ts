import { queryOptions, useQuery } from "@tanstack/react-query";
import { systemRecords, todayResponse } from "#core/contracts/compliance";
import { api } from "../../lib/api-client";
import { recordsKeys } from "./records-keys";

export function getToday(storeId: string | undefined, signal?: AbortSignal) {
  return api.get(`/api/today${storeId ? `?storeId=${encodeURIComponent(storeId)}` : ""}`, todayResponse, signal);
}

export function todayQueryOptions(storeId?: string) {
  // Deadlines move when anyone records a repair or an addition: read afresh on every visit.
  return queryOptions({
    queryKey: recordsKeys.today(storeId),
    queryFn: ({ signal }) => getToday(storeId, signal),
    staleTime: 0,
  });
}

export function useToday(storeId?: string) {
  return useQuery(todayQueryOptions(storeId));
}

export function getSystemRecords(systemId: string, signal?: AbortSignal) {
  return api.get(`/api/systems/${systemId}/records`, systemRecords, signal);
}

export function systemRecordsQueryOptions(systemId: string) {
  return queryOptions({
    queryKey: recordsKeys.system(systemId),
    queryFn: ({ signal }) => getSystemRecords(systemId, signal),
  });
}

export function useSystemRecords(systemId: string) {
  return useQuery(systemRecordsQueryOptions(systemId));
}
