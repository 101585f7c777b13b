// The field map's own answers; sweeps, plans, fixtures, findings and analyses are entities (src/entities/).
export const fieldmapKeys = {
  all: ["fieldmap"] as const,
  sends: (sweepId: string) => [...fieldmapKeys.all, "sweep", sweepId, "sends"] as const,
  recipients: (sweepId: string) => [...fieldmapKeys.all, "sweep", sweepId, "recipients"] as const,
  trends: (storeId: string, a: string | null, b: string | null) =>
    [...fieldmapKeys.all, "store", storeId, "trends", a, b] as const,
};
