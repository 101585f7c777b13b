import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { findingDetail, findingListResponse } from "#core/contracts/finding-actions";
import { api } from "../../../lib/api-client";
import { fieldmapKeys } from "./fieldmap-keys";
import type { SuspectSpot } from "./get-analysis";

export type SweepFinding = z.infer<typeof findingDetail>;

export function storeFindingsQueryOptions(storeId: string) {
  return queryOptions({
    queryKey: fieldmapKeys.findings(storeId),
    queryFn: async ({ signal }) =>
      (await api.get(`/api/stores/${storeId}/findings`, findingListResponse, signal)).findings,
  });
}

export function useStoreFindings(storeId: string) {
  return useQuery(storeFindingsQueryOptions(storeId));
}

/** One action: the suspect spot becomes a suspected finding at its place, on its fixture. */
export function useFindingFromSpot(storeId: string, sweepId: string, planId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (spot: SuspectSpot & { fixtureIsAirVolume: boolean }) =>
      api.post(`/api/stores/${storeId}/findings`, findingDetail.or(z.object({ finding: findingDetail })), {
        clientId: crypto.randomUUID(),
        source: "suspect-spot",
        status: "suspected",
        sweepId,
        planId,
        fixtureId: spot.fixtureIsAirVolume ? spot.fixtureId : null,
        x: spot.x,
        y: spot.y,
        note: `Suspect spot ${spot.rank}: ${spot.reason} Next check: ${spot.nextCheck}`,
      }),
    onSuccess: () => qc.invalidateQueries({ queryKey: fieldmapKeys.findings(storeId) }),
  });
}

/** Marks a finding repaired; a suspected one is confirmed first (a repair implies the leak was found). */
export function useMarkRepaired(storeId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ finding, on, note }: { finding: SweepFinding; on: string; note: string }) => {
      if (finding.status === "suspected")
        await api.post(`/api/findings/${finding.id}/events`, null, {
          action: "confirm",
          on,
          note: "Confirmed at the repair.",
        });
      return api.post(`/api/findings/${finding.id}/events`, null, { action: "repair", on, note });
    },
    onSuccess: () => qc.invalidateQueries({ queryKey: fieldmapKeys.findings(storeId) }),
  });
}
