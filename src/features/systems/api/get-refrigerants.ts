import { queryOptions, useQuery } from "@tanstack/react-query";
import { refrigerantListResponse } from "#core/contracts/systems";
import { api } from "../../../lib/api-client";
import { refrigerantKeys } from "./systems-keys";

/** The catalogue with GWP on the company's chosen basis and each refrigerant's cautions. */
export async function getRefrigerants(signal?: AbortSignal) {
  const { refrigerants } = await api.get("/api/refrigerants", refrigerantListResponse, signal);
  return refrigerants;
}

export function refrigerantsQueryOptions() {
  return queryOptions({
    queryKey: refrigerantKeys.all,
    queryFn: ({ signal }) => getRefrigerants(signal),
    staleTime: 60 * 60 * 1000,
  });
}

export function useRefrigerants() {
  return useQuery(refrigerantsQueryOptions());
}
