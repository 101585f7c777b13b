import { queryOptions, useQuery } from "@tanstack/react-query";
import { readingListResponse, sweepListResponse } from "#core/contracts/list-responses";
import { sweep } from "#core/contracts/sweeps";
import { api } from "../../lib/api-client";
import { sweepsKeys } from "./sweeps-keys";

export async function getSweeps(storeId: string, signal?: AbortSignal) {
  return (await api.get(`/api/stores/${storeId}/sweeps`, sweepListResponse, signal)).sweeps;
}

export function sweepsQueryOptions(storeId: string) {
  return queryOptions({ queryKey: sweepsKeys.list(storeId), queryFn: ({ signal }) => getSweeps(storeId, signal) });
}

export function useSweeps(storeId: string) {
  return useQuery(sweepsQueryOptions(storeId));
}

/** The company's sweeps still in progress in the stores the member sees, the member's own first. */
export async function getInProgressSweeps(signal?: AbortSignal) {
  return (await api.get("/api/sweeps/in-progress", sweepListResponse, signal)).sweeps;
}

export function getSweep(id: string, signal?: AbortSignal) {
  return api.get(`/api/sweeps/${id}`, sweep, signal);
}

export function sweepQueryOptions(id: string) {
  return queryOptions({ queryKey: sweepsKeys.detail(id), queryFn: ({ signal }) => getSweep(id, signal) });
}

export function useSweep(id: string) {
  return useQuery(sweepQueryOptions(id));
}

/** The sweep's stored readings (the Walk screen copies them onto a device that lacks them). */
export async function getSweepReadings(id: string, signal?: AbortSignal) {
  return (await api.get(`/api/sweeps/${id}/readings`, readingListResponse, signal)).readings;
}

/** The stored readings, read only when `enabled` (the field map asks for them when the sweep has pinpoint passes). */
export function useSweepReadings(id: string, enabled: boolean) {
  return useQuery({
    queryKey: sweepsKeys.readings(id),
    queryFn: ({ signal }) => getSweepReadings(id, signal),
    enabled,
  });
}
