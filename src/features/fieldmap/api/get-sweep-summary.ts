import { queryOptions, useQuery } from "@tanstack/react-query";
import { sweepSummaryResponse } from "#core/contracts/sweep-summary";
import { api } from "../../../lib/api-client";
import { sweepsKeys } from "../../../entities/sweeps/sweeps-keys";

export function useSweepSummary(storeId: string) {
  return useQuery(
    queryOptions({
      queryKey: sweepsKeys.summary(storeId),
      queryFn: async ({ signal }) =>
        (await api.get(`/api/stores/${storeId}/sweep-summary`, sweepSummaryResponse, signal)).sweeps,
    }),
  );
}
