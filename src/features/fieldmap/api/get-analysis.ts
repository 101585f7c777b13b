import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "../../../lib/api-client";
import { decodeField } from "#core/domain/fieldmap/field-codec";
import { fieldmapKeys } from "./fieldmap-keys";

const point = z.object({ x: z.number(), y: z.number() });

export const candidateSchema = z.object({
  rank: z.number(),
  x: z.number(),
  y: z.number(),
  radius: z.number(),
  score: z.number(),
  strength: z.number(),
  strengthGPerYear: z.number(),
  fixtureId: z.string().nullable(),
  riskPointId: z.string().nullable(),
  reason: z.string(),
  nextCheck: z.string(),
});
export type SuspectSpot = z.infer<typeof candidateSchema>;

const analysisSchema = z.object({
  sweepId: z.uuid(),
  params: z.object({
    transportDelayS: z.number(),
    timeConstantS: z.number(),
    alarmPpm: z.number(),
    cellSize: z.number(),
  }),
  candidates: z.array(candidateSchema),
  background: z.object({ ppm: z.number() }),
  diagnostics: z.array(
    z.object({
      kind: z.string(),
      message: z.string(),
      fixtureId: z.string().optional(),
      zoneId: z.string().optional(),
    }),
  ),
  assumptions: z.array(z.string()),
  readings: z.array(
    z.object({
      index: z.number(),
      readingId: z.string(),
      raw: point,
      corrected: point,
      t: z.number(),
      ppm: z.number(),
      flags: z.array(z.string()),
    }),
  ),
  readingsRevision: z.number(),
  currentReadingsRevision: z.number(),
  stale: z.boolean(),
  recomputing: z.boolean(),
  computedAt: z.string(),
  durationMs: z.number(),
  field: z.object({
    width: z.number(),
    height: z.number(),
    cellSize: z.number(),
    values: z.string(),
    confidence: z.string(),
  }),
});

export type Analysis = Omit<z.infer<typeof analysisSchema>, "field"> & { field: ReturnType<typeof decodeField> };

export async function getAnalysis(
  sweepId: string,
  transportDelayS: number | null,
  signal?: AbortSignal,
): Promise<Analysis> {
  const q = transportDelayS === null ? "" : `?transportDelayS=${encodeURIComponent(transportDelayS)}`;
  const body = await api.get(`/api/sweeps/${sweepId}/analysis${q}`, analysisSchema, signal);
  return { ...body, field: decodeField(body.field) };
}

export function analysisQueryOptions(sweepId: string, transportDelayS: number | null) {
  return queryOptions({
    queryKey: fieldmapKeys.analysis(sweepId, transportDelayS),
    queryFn: ({ signal }) => getAnalysis(sweepId, transportDelayS, signal),
    // a stale result is being recomputed on the server: ask again until the fresh one is there
    refetchInterval: (q) => (q.state.data?.stale ? 1500 : false),
    staleTime: 30_000,
  });
}

export function useAnalysis(sweepId: string, transportDelayS: number | null, enabled = true) {
  return useQuery({ ...analysisQueryOptions(sweepId, transportDelayS), enabled });
}
