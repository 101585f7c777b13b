import { useMutation, useQueryClient } from "@tanstack/react-query";
import { detector, type DetectorInput } from "#core/contracts/detectors";
import { invalidateEntity } from "../../../entities/invalidate";
import { api } from "../../../lib/api-client";

export function useSaveDetector() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: string | null; input: DetectorInput }) =>
      id ? api.put(`/api/detectors/${id}`, detector, input) : api.post("/api/detectors", detector, input),
    onSuccess: () => invalidateEntity(qc, "detector"),
  });
}

export function useArchiveDetector() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, archived }: { id: string; archived: boolean }) =>
      api.post(`/api/detectors/${id}/${archived ? "archive" : "restore"}`, detector),
    onSuccess: () => invalidateEntity(qc, "detector"),
  });
}
