/** A store's refrigeration systems, general to specific. */
export const systemsKeys = {
  all: ["systems"] as const,
  lists: () => [...systemsKeys.all, "list"] as const,
  list: (storeId: string) => [...systemsKeys.lists(), { storeId }] as const,
  retired: (storeId: string) => [...systemsKeys.lists(), { storeId, retired: true }] as const,
};
