import { queryOptions, useQuery } from "@tanstack/react-query";
import { findingDetail, findingListResponse } from "#core/contracts/finding-actions";
import { api } from "../../../lib/api-client";
import { findingsKeys } from "./findings-keys";

export function getFindings(storeId: string, systemId: string | undefined, signal?: AbortSignal) {
  return api
    .get(`/api/stores/${storeId}/findings${systemId ? `?systemId=${systemId}` : ""}`, findingListResponse, signal)
    .then((r) => r.findings);
}

export function findingsQueryOptions(storeId: string, systemId?: string) {
  return queryOptions({
    queryKey: findingsKeys.list(storeId, systemId),
    queryFn: ({ signal }) => getFindings(storeId, systemId, signal),
  });
}

export function useFindings(storeId: string | undefined, systemId?: string) {
  return useQuery({ ...findingsQueryOptions(storeId ?? "", systemId), enabled: !!storeId });
}

export function findingQueryOptions(id: string) {
  return queryOptions({
    queryKey: findingsKeys.detail(id),
    queryFn: ({ signal }) => api.get(`/api/findings/${id}`, findingDetail, signal),
  });
}

export function useFinding(id: string) {
  return useQuery(findingQueryOptions(id));
}
