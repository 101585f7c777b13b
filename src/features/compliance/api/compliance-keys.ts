export const complianceKeys = {
  all: ["compliance"] as const,
  today: (storeId?: string) => [...complianceKeys.all, "today", storeId ?? "all"] as const,
  records: () => [...complianceKeys.all, "records"] as const,
  record: (systemId: string) => [...complianceKeys.records(), systemId] as const,
  readings: () => [...complianceKeys.all, "readings"] as const,
  revisions: (systemId: string) => [...complianceKeys.all, "revisions", systemId] as const,
};
