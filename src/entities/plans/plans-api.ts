import { queryOptions, useQuery } from "@tanstack/react-query";
import { planListResponse } from "#core/contracts/list-responses";
import { fixturesResponse, plan } from "#core/contracts/plans";
import { api } from "../../lib/api-client";
import { fixturesKeys, plansKeys } from "./plans-keys";

/** Every plan version of a store, newest first (the first is the current one). */
export async function getPlans(storeId: string, signal?: AbortSignal) {
  const { plans } = await api.get(`/api/stores/${storeId}/plans`, planListResponse, signal);
  return [...plans].sort((a, b) => b.version - a.version);
}

export function plansQueryOptions(storeId: string) {
  return queryOptions({ queryKey: plansKeys.list(storeId), queryFn: ({ signal }) => getPlans(storeId, signal) });
}

export function usePlans(storeId: string) {
  return useQuery(plansQueryOptions(storeId));
}

export function getPlan(id: string, signal?: AbortSignal) {
  return api.get(`/api/plans/${id}`, plan, signal);
}

export function planQueryOptions(id: string) {
  return queryOptions({ queryKey: plansKeys.detail(id), queryFn: ({ signal }) => getPlan(id, signal) });
}

export function usePlan(id: string) {
  return useQuery(planQueryOptions(id));
}

export function getPlanFixtures(planId: string, signal?: AbortSignal) {
  return api.get(`/api/plans/${planId}/fixtures`, fixturesResponse, signal);
}

export function planFixturesQueryOptions(planId: string) {
  return queryOptions({
    queryKey: fixturesKeys.list(planId),
    queryFn: ({ signal }) => getPlanFixtures(planId, signal),
    staleTime: 60_000,
  });
}

export function usePlanFixtures(planId: string | undefined) {
  return useQuery({ ...planFixturesQueryOptions(planId ?? ""), enabled: !!planId });
}
