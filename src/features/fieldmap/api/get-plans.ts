import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { fixturesResponse, plan } from "#core/contracts/plans";
import { api } from "../../../lib/api-client";
import { fieldmapKeys } from "./fieldmap-keys";

export function storePlansQueryOptions(storeId: string) {
  return queryOptions({
    queryKey: fieldmapKeys.plans(storeId),
    queryFn: async ({ signal }) =>
      (await api.get(`/api/stores/${storeId}/plans`, z.object({ plans: z.array(plan) }), signal)).plans,
    staleTime: 60_000,
  });
}

export function useStorePlans(storeId: string) {
  return useQuery(storePlansQueryOptions(storeId));
}

export function planFixturesQueryOptions(planId: string) {
  return queryOptions({
    queryKey: fieldmapKeys.fixtures(planId),
    queryFn: ({ signal }) => api.get(`/api/plans/${planId}/fixtures`, fixturesResponse, signal),
    staleTime: 60_000,
  });
}

export function usePlanFixtures(planId: string | undefined) {
  return useQuery({ ...planFixturesQueryOptions(planId ?? ""), enabled: !!planId });
}
