/**
 * Feature-only answers of the records screens. The records themselves (Today, a system's records)
 * are the records entity (src/entities/records/records-keys.ts).
 */
export const complianceKeys = {
  all: ["compliance"] as const,
  readings: () => [...complianceKeys.all, "readings"] as const,
  revisions: (systemId: string) => [...complianceKeys.all, "revisions", systemId] as const,
};
