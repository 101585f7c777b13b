import { queryOptions, useQuery } from "@tanstack/react-query";
import { systemListResponse } from "#core/contracts/systems";
import { api } from "../../lib/api-client";
import { systemsKeys } from "./systems-keys";

export async function getSystems(storeId: string, signal?: AbortSignal) {
  const { systems } = await api.get(`/api/stores/${storeId}/systems`, systemListResponse, signal);
  return systems;
}

export function systemsQueryOptions(storeId: string) {
  return queryOptions({ queryKey: systemsKeys.list(storeId), queryFn: ({ signal }) => getSystems(storeId, signal) });
}

export function useSystems(storeId: string) {
  return useQuery(systemsQueryOptions(storeId));
}

/** The store's retired systems: out of service, their records kept and readable (docs/decisions/0040). */
export function useRetiredSystems(storeId: string) {
  return useQuery({
    queryKey: systemsKeys.retired(storeId),
    queryFn: async ({ signal }) => {
      const { systems } = await api.get(`/api/stores/${storeId}/systems?include=retired`, systemListResponse, signal);
      return systems.filter((s) => s.retired !== null);
    },
  });
}
