import type { StoreListQuery } from "#core/contracts/stores";

export type StoreListFilter = Partial<Pick<StoreListQuery, "search" | "sort" | "order" | "includeArchived">>;

/** Stores, general to specific. A store's detail is the whole store page (store, systems, plans). */
export const storesKeys = {
  all: ["stores"] as const,
  lists: () => [...storesKeys.all, "list"] as const,
  list: (filter: StoreListFilter = {}) => [...storesKeys.lists(), filter] as const,
  details: () => [...storesKeys.all, "detail"] as const,
  detail: (id: string) => [...storesKeys.details(), id] as const,
};
