import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { store } from "#core/contracts/stores";
import { api } from "../../../lib/api-client";
import { storesKeys } from "./stores-keys";

// GET /api/stores/:id also carries systems and plans; this feature reads only the store itself,
// the systems and plans features read their own endpoints.
const storeDetailResponse = z.object({ store });

export async function getStore(id: string, signal?: AbortSignal) {
  const { store: s } = await api.get(`/api/stores/${id}`, storeDetailResponse, signal);
  return s;
}

export function storeQueryOptions(id: string) {
  return queryOptions({ queryKey: storesKeys.detail(id), queryFn: ({ signal }) => getStore(id, signal) });
}

export function useStore(id: string) {
  return useQuery(storeQueryOptions(id));
}
