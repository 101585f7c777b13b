/**
 * The compliance records as the server derives them on each read: the Today lists (all stores or
 * one) and one system's records. Both move whenever a finding, a charge or a detector changes.
 */
export const recordsKeys = {
  all: ["records"] as const,
  todays: () => [...recordsKeys.all, "today"] as const,
  today: (storeId?: string) => [...recordsKeys.todays(), { storeId: storeId ?? null }] as const,
  systems: () => [...recordsKeys.all, "system"] as const,
  system: (systemId: string) => [...recordsKeys.systems(), systemId] as const,
};
