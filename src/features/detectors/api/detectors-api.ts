import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { detector, type DetectorInput } from "#core/contracts/detectors";
import { api } from "../../../lib/api-client";

export const detectorsKeys = {
  all: ["detectors"] as const,
  lists: () => [...detectorsKeys.all, "list"] as const,
  list: (includeArchived: boolean) => [...detectorsKeys.lists(), { includeArchived }] as const,
};

const listResponse = z.object({ detectors: z.array(detector) });

export function detectorsQueryOptions(includeArchived: boolean) {
  return queryOptions({
    queryKey: detectorsKeys.list(includeArchived),
    queryFn: ({ signal }) =>
      api.get(`/api/detectors?includeArchived=${includeArchived}`, listResponse, signal).then((r) => r.detectors),
  });
}

export function useDetectors(includeArchived: boolean) {
  return useQuery(detectorsQueryOptions(includeArchived));
}

export function useSaveDetector() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: string | null; input: DetectorInput }) =>
      id ? api.put(`/api/detectors/${id}`, detector, input) : api.post("/api/detectors", detector, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: detectorsKeys.lists() }),
  });
}

export function useArchiveDetector() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, archived }: { id: string; archived: boolean }) =>
      api.post(`/api/detectors/${id}/${archived ? "archive" : "restore"}`, detector),
    onSuccess: () => qc.invalidateQueries({ queryKey: detectorsKeys.lists() }),
  });
}
