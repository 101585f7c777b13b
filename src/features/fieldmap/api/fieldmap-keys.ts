export const fieldmapKeys = {
  all: ["fieldmap"] as const,
  sweeps: (storeId: string) => [...fieldmapKeys.all, "store", storeId, "sweeps"] as const,
  sweep: (sweepId: string) => [...fieldmapKeys.all, "sweep", sweepId] as const,
  analysis: (sweepId: string, transportDelayS: number | null) =>
    [...fieldmapKeys.all, "sweep", sweepId, "analysis", transportDelayS ?? "detector"] as const,
  plans: (storeId: string) => [...fieldmapKeys.all, "store", storeId, "plans"] as const,
  fixtures: (planId: string) => [...fieldmapKeys.all, "plan", planId, "fixtures"] as const,
  findings: (storeId: string) => [...fieldmapKeys.all, "store", storeId, "findings"] as const,
  sends: (sweepId: string) => [...fieldmapKeys.all, "sweep", sweepId, "sends"] as const,
  recipients: (sweepId: string) => [...fieldmapKeys.all, "sweep", sweepId, "recipients"] as const,
  trends: (storeId: string, a: string | null, b: string | null) =>
    [...fieldmapKeys.all, "store", storeId, "trends", a, b] as const,
};
