/** Findings, general to specific: a store's list (optionally one system's), then one finding. */
export const findingsKeys = {
  all: ["findings"] as const,
  lists: () => [...findingsKeys.all, "list"] as const,
  list: (storeId: string, systemId?: string) =>
    [...findingsKeys.lists(), { storeId, systemId: systemId ?? null }] as const,
  details: () => [...findingsKeys.all, "detail"] as const,
  detail: (id: string) => [...findingsKeys.details(), id] as const,
};
