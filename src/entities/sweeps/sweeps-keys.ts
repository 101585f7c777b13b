/** Sweeps, general to specific; a sweep's readings and analyses hang under its detail. */
export const sweepsKeys = {
  all: ["sweeps"] as const,
  lists: () => [...sweepsKeys.all, "list"] as const,
  list: (storeId: string) => [...sweepsKeys.lists(), { storeId }] as const,
  /** The company's sweeps still in progress, for resuming (GET /api/sweeps/in-progress). */
  inProgress: () => [...sweepsKeys.lists(), "in-progress"] as const,
  /** A store's last sweeps with their peaks, findings and suspects (the store page's plot). */
  summaries: () => [...sweepsKeys.all, "summary"] as const,
  summary: (storeId: string) => [...sweepsKeys.summaries(), storeId] as const,
  details: () => [...sweepsKeys.all, "detail"] as const,
  detail: (id: string) => [...sweepsKeys.details(), id] as const,
  analyses: (id: string) => [...sweepsKeys.detail(id), "analysis"] as const,
  readings: (id: string) => [...sweepsKeys.detail(id), "readings"] as const,
  analysis: (id: string, transportDelayS: number | null) =>
    [...sweepsKeys.analyses(id), transportDelayS ?? "detector"] as const,
};
