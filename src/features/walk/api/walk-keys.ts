export const walkKeys = {
  all: ["walk"] as const,
  storePack: (storeId: string) => [...walkKeys.all, "store-pack", storeId] as const,
  planPack: (planId: string) => [...walkKeys.all, "plan-pack", planId] as const,
  resumable: (storeId: string | null) => [...walkKeys.all, "resumable", storeId ?? "all"] as const,
};
