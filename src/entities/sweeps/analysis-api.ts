import { queryOptions, useQuery } from "@tanstack/react-query";
import { analysisResponse, type AnalysisResponse } from "#core/contracts/analysis";
import { decodeField } from "#core/domain/fieldmap/field-codec";
import { api } from "../../lib/api-client";
import { sweepsKeys } from "./sweeps-keys";

/** The analysis as the server sends it (the same schema), with the grid decoded for drawing. */
export type Analysis = Omit<AnalysisResponse, "field"> & { field: ReturnType<typeof decodeField> };

export async function getAnalysis(
  sweepId: string,
  transportDelayS: number | null,
  signal?: AbortSignal,
): Promise<Analysis> {
  const q = transportDelayS === null ? "" : `?transportDelayS=${encodeURIComponent(transportDelayS)}`;
  const body = await api.get(`/api/sweeps/${sweepId}/analysis${q}`, analysisResponse, signal);
  return { ...body, field: decodeField(body.field) };
}

export function analysisQueryOptions(sweepId: string, transportDelayS: number | null) {
  return queryOptions({
    queryKey: sweepsKeys.analysis(sweepId, transportDelayS),
    queryFn: ({ signal }) => getAnalysis(sweepId, transportDelayS, signal),
    // a stale result is being recomputed on the server: ask again until the fresh one is there
    refetchInterval: (q) => (q.state.data?.stale ? 1500 : false),
    staleTime: 30_000,
  });
}

export function useAnalysis(sweepId: string, transportDelayS: number | null, enabled = true) {
  return useQuery({ ...analysisQueryOptions(sweepId, transportDelayS), enabled });
}
