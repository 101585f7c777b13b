import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { SuspectSpot } from "#core/contracts/analysis";
import type { PresentedSpot } from "#core/domain/locator-words/present-analysis";
import { findingDetail, type FindingDetail } from "#core/contracts/finding-actions";
import { invalidateEntity } from "../../../entities/invalidate";
import { api } from "../../../lib/api-client";

/** One action: the suspect spot becomes a suspected finding at its place, on its fixture. */
export function useFindingFromSpot(storeId: string, sweepId: string, planId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({
      spot,
      words,
      fixtureIsAirVolume,
    }: {
      spot: SuspectSpot;
      words: PresentedSpot;
      fixtureIsAirVolume: boolean;
    }) =>
      api.post(`/api/stores/${storeId}/findings`, findingDetail, {
        clientId: crypto.randomUUID(),
        source: "suspect-spot",
        status: "suspected",
        sweepId,
        planId,
        fixtureId: fixtureIsAirVolume ? spot.fixtureId : null,
        x: spot.x,
        y: spot.y,
        note: `Suspect spot ${spot.rank}: ${words.reason} Next check: ${words.nextCheck}`,
      }),
    onSuccess: () => invalidateEntity(qc, "finding"),
  });
}

/** Marks a finding repaired; a suspected one is confirmed first (a repair implies the leak was found). */
export function useMarkRepaired() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ finding, on, note }: { finding: FindingDetail; on: string; note: string }) => {
      if (finding.status === "suspected")
        await api.post(`/api/findings/${finding.id}/events`, null, {
          action: "confirm",
          on,
          note: "Confirmed at the repair.",
        });
      return api.post(`/api/findings/${finding.id}/events`, findingDetail, { action: "repair", on, note });
    },
    onSuccess: () => invalidateEntity(qc, "finding"),
  });
}
