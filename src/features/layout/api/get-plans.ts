import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { plan } from "#core/contracts/plans";
import { api } from "../../../lib/api-client";
import { plansKeys } from "./plans-keys";

const planListResponse = z.object({ plans: z.array(plan) });

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
