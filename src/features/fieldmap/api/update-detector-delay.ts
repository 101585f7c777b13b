import { useMutation, useQueryClient } from "@tanstack/react-query";
import { detector } from "#core/contracts/detectors";
import { invalidateEntity } from "../../../entities/invalidate";
import { api } from "../../../lib/api-client";

/**
 * Sets a detector's transport delay to the one the readings support, through the detector API (the
 * detector as it is now, only the delay changed). New sweeps copy it, and the Walk screen's lag hint
 * reads it, so the hint and the locator keep using the same delay.
 */
export function useUpdateDetectorDelay() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ detectorId, transportDelayS }: { detectorId: string; transportDelayS: number }) => {
      const {
        id: _id,
        archivedAt: _archived,
        checkDueOn: _due,
        overdue: _overdue,
        ...input
      } = await api.get(`/api/detectors/${detectorId}`, detector);
      return api.put(`/api/detectors/${detectorId}`, detector, { ...input, transportDelayS });
    },
    onSuccess: () => invalidateEntity(qc, "detector"),
  });
}
