import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { sweep } from "#core/contracts/sweeps";
import { api } from "../../../lib/api-client";
import { fieldmapKeys } from "./fieldmap-keys";

export function storeSweepsQueryOptions(storeId: string) {
  return queryOptions({
    queryKey: fieldmapKeys.sweeps(storeId),
    queryFn: async ({ signal }) =>
      (await api.get(`/api/stores/${storeId}/sweeps`, z.object({ sweeps: z.array(sweep) }), signal)).sweeps,
  });
}

export function useStoreSweeps(storeId: string) {
  return useQuery(storeSweepsQueryOptions(storeId));
}

export function sweepQueryOptions(sweepId: string) {
  return queryOptions({
    queryKey: fieldmapKeys.sweep(sweepId),
    queryFn: ({ signal }) => api.get(`/api/sweeps/${sweepId}`, sweep, signal),
  });
}

export function useSweep(sweepId: string) {
  return useQuery(sweepQueryOptions(sweepId));
}
