import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "../../../lib/api-client";
import { storesKeys } from "./stores-keys";

// server/contracts has no stores schema yet; this mirrors the foundation API note
// (GET /api/stores) until the stores work adds one to share.
export const storeSummary = z.object({
  id: z.uuid(),
  name: z.string(),
  address: z.string(),
  timeZone: z.string(),
  archivedAt: z.string().nullable(),
});
export type StoreSummary = z.infer<typeof storeSummary>;

const storesResponse = z.object({ stores: z.array(storeSummary) });

export async function getStores(signal?: AbortSignal): Promise<StoreSummary[]> {
  const { stores } = await api.get("/api/stores", storesResponse, signal);
  return stores;
}

export function storesQueryOptions() {
  return queryOptions({
    queryKey: storesKeys.list(),
    queryFn: ({ signal }) => getStores(signal),
  });
}

export function useStores(options: { enabled?: boolean } = {}) {
  return useQuery({ ...storesQueryOptions(), enabled: options.enabled ?? true });
}
