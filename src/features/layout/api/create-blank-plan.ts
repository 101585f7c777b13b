import { useMutation, useQueryClient } from "@tanstack/react-query";
import { plan, type BlankPlanInput } from "#core/contracts/plans";
import { api } from "../../../lib/api-client";
import { plansKeys } from "./plans-keys";

export function createBlankPlan({ storeId, input }: { storeId: string; input: BlankPlanInput }) {
  return api.post(`/api/stores/${storeId}/plans/blank`, plan, input);
}

export function useCreateBlankPlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBlankPlan,
    onSuccess: (saved) => {
      queryClient.setQueryData(plansKeys.detail(saved.id), saved);
      return queryClient.invalidateQueries({ queryKey: plansKeys.list(saved.storeId) });
    },
  });
}
