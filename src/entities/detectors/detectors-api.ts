import { queryOptions, useQuery } from "@tanstack/react-query";
import { detectorListResponse } from "#core/contracts/list-responses";
import { api } from "../../lib/api-client";
import { detectorsKeys } from "./detectors-keys";

export async function getDetectors(includeArchived: boolean, signal?: AbortSignal) {
  return (await api.get(`/api/detectors?includeArchived=${includeArchived}`, detectorListResponse, signal)).detectors;
}

export function detectorsQueryOptions(includeArchived: boolean) {
  return queryOptions({
    queryKey: detectorsKeys.list(includeArchived),
    queryFn: ({ signal }) => getDetectors(includeArchived, signal),
  });
}

export function useDetectors(includeArchived: boolean) {
  return useQuery(detectorsQueryOptions(includeArchived));
}
