import { queryOptions, useQuery } from "@tanstack/react-query";
import { plan } from "#core/contracts/plans";
import { api } from "../../../lib/api-client";
import { plansKeys } from "./plans-keys";

export function getPlan(id: string, signal?: AbortSignal) {
  return api.get(`/api/plans/${id}`, plan, signal);
}

export function planQueryOptions(id: string) {
  return queryOptions({ queryKey: plansKeys.detail(id), queryFn: ({ signal }) => getPlan(id, signal) });
}

export function usePlan(id: string) {
  return useQuery(planQueryOptions(id));
}
