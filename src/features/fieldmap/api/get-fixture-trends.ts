import { useQuery } from "@tanstack/react-query";
import { fixtureTrendsResponse } from "#core/contracts/fixture-trends";
import { api } from "../../../lib/api-client";
import { fieldmapKeys } from "./fieldmap-keys";

export function useFixtureTrends(storeId: string, a: string | null, b: string | null) {
  const q = new URLSearchParams();
  if (a) q.set("a", a);
  if (b) q.set("b", b);
  return useQuery({
    queryKey: fieldmapKeys.trends(storeId, a, b),
    queryFn: ({ signal }) =>
      api.get(`/api/stores/${storeId}/fixture-trends${q.size ? `?${q}` : ""}`, fixtureTrendsResponse, signal),
  });
}
