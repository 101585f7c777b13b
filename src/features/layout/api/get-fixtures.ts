import { queryOptions, useQuery } from "@tanstack/react-query";
import { fixturesResponse } from "#core/contracts/plans";
import { api } from "../../../lib/api-client";
import { layoutKeys } from "./layout-keys";

export function getFixtures(planId: string, signal?: AbortSignal) {
  return api.get(`/api/plans/${planId}/fixtures`, fixturesResponse, signal);
}

export function fixturesQueryOptions(planId: string) {
  return queryOptions({
    queryKey: layoutKeys.planFixtures(planId),
    queryFn: ({ signal }) => getFixtures(planId, signal),
    // The editor owns the fixtures while it is open; a background refetch must not replace a draft.
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });
}

export function useFixtures(planId: string) {
  return useQuery(fixturesQueryOptions(planId));
}
