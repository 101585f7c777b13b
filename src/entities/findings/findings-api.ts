import { queryOptions, useQuery } from "@tanstack/react-query";
import { findingDetail, findingListResponse } from "#core/contracts/finding-actions";
import { api } from "../../lib/api-client";
import { findingsKeys } from "./findings-keys";

export async function getFindings(storeId: string, systemId: string | undefined, signal?: AbortSignal) {
  const q = systemId ? `?systemId=${encodeURIComponent(systemId)}` : "";
  return (await api.get(`/api/stores/${storeId}/findings${q}`, findingListResponse, signal)).findings;
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

export function getFinding(id: string, signal?: AbortSignal) {
  return api.get(`/api/findings/${id}`, findingDetail, signal);
}

export function findingQueryOptions(id: string) {
  return queryOptions({ queryKey: findingsKeys.detail(id), queryFn: ({ signal }) => getFinding(id, signal) });
}

export function useFinding(id: string) {
  return useQuery(findingQueryOptions(id));
}
