import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { storeDetailResponse } from "#core/contracts/list-responses";
import { storeListResponse, type Store } from "#core/contracts/stores";
import { api } from "../../lib/api-client";
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

/** The store page: the store, its systems, the current plan and every plan version. */
export function getStoreDetail(id: string, signal?: AbortSignal) {
  return api.get(`/api/stores/${id}`, storeDetailResponse, signal);
}

export function storeDetailQueryOptions(id: string) {
  return queryOptions({ queryKey: storesKeys.detail(id), queryFn: ({ signal }) => getStoreDetail(id, signal) });
}

/** The store alone, read from the same cached store page. */
export function useStore(id: string) {
  return useQuery({ ...storeDetailQueryOptions(id), select: (detail) => detail.store });
}
