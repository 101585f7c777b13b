export const plansKeys = {
  all: ["plans"] as const,
  lists: () => [...plansKeys.all, "list"] as const,
  list: (storeId: string) => [...plansKeys.lists(), { storeId }] as const,
  details: () => [...plansKeys.all, "detail"] as const,
  detail: (id: string) => [...plansKeys.details(), id] as const,
};
