import { useMutation, useQueryClient } from "@tanstack/react-query";
import { calibrationResponse, type CalibrationInput } from "#core/contracts/plans";
import { api } from "../../../lib/api-client";
import { plansKeys } from "./plans-keys";

/** Saves the scale; the answer says whether fixtures were rescaled or a new version was made (sweeps exist). */
export function calibratePlan({ planId, input }: { planId: string; input: CalibrationInput }) {
  return api.post(`/api/plans/${planId}/calibration`, calibrationResponse, input);
}

export function useCalibratePlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: calibratePlan,
    onSuccess: ({ plan }) => {
      queryClient.setQueryData(plansKeys.detail(plan.id), plan);
      return queryClient.invalidateQueries({ queryKey: plansKeys.list(plan.storeId) });
    },
  });
}
