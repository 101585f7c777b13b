export const systemsKeys = {
  all: ["systems"] as const,
  lists: () => [...systemsKeys.all, "list"] as const,
  list: (storeId: string) => [...systemsKeys.lists(), { storeId }] as const,
  details: () => [...systemsKeys.all, "detail"] as const,
  detail: (id: string) => [...systemsKeys.details(), id] as const,
  refrigerants: () => [...systemsKeys.all, "refrigerants"] as const,
};
