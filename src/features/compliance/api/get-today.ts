import { queryOptions, useQuery } from "@tanstack/react-query";
import { todayResponse } from "#core/contracts/compliance";
import { api } from "../../../lib/api-client";
import { complianceKeys } from "./compliance-keys";

export function getToday(storeId: string | undefined, signal?: AbortSignal) {
  return api.get(`/api/today${storeId ? `?storeId=${encodeURIComponent(storeId)}` : ""}`, todayResponse, signal);
}

export function todayQueryOptions(storeId?: string) {
  // Deadlines move when anyone records a repair or an addition: read afresh on every visit.
  return queryOptions({
    queryKey: complianceKeys.today(storeId),
    queryFn: ({ signal }) => getToday(storeId, signal),
    staleTime: 0,
  });
}

export function useToday(storeId?: string) {
  return useQuery(todayQueryOptions(storeId));
}
