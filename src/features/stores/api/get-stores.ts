import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { storeListResponse, type Store } from "#core/contracts/stores";
import { api } from "../../../lib/api-client";
import { storesKeys, type StoreListFilter } from "./stores-keys";

function queryString(filter: StoreListFilter): string {
  const params = new URLSearchParams();
  if (filter.search) params.set("search", filter.search);
  if (filter.sort) params.set("sort", filter.sort);
  if (filter.order) params.set("order", filter.order);
  if (filter.includeArchived) params.set("includeArchived", "true");
  const q = params.toString();
  return q ? `?${q}` : "";
}

export async function getStores(filter: StoreListFilter = {}, signal?: AbortSignal): Promise<Store[]> {
  const { stores } = await api.get(`/api/stores${queryString(filter)}`, storeListResponse, signal);
  return stores;
}

export function storesQueryOptions(filter: StoreListFilter = {}) {
  return queryOptions({
    queryKey: storesKeys.list(filter),
    queryFn: ({ signal }) => getStores(filter, signal),
    // Typing in the search box keeps the last rows on screen instead of flashing a spinner.
    placeholderData: keepPreviousData,
  });
}

export function useStores(filter: StoreListFilter = {}, options: { enabled?: boolean } = {}) {
  return useQuery({ ...storesQueryOptions(filter), enabled: options.enabled ?? true });
}
