import { useMutation, useQueryClient } from "@tanstack/react-query";
import { plan, type AlignmentInput } from "#core/contracts/plans";
import { api } from "../../../lib/api-client";
import { plansKeys } from "./plans-keys";

/** Stores how this version lies on the previous one, from two matched points. */
export function setAlignment({ planId, input }: { planId: string; input: AlignmentInput }) {
  return api.put(`/api/plans/${planId}/alignment`, plan, input);
}

export function useSetAlignment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setAlignment,
    onSuccess: (saved) => {
      queryClient.setQueryData(plansKeys.detail(saved.id), saved);
      return queryClient.invalidateQueries({ queryKey: plansKeys.list(saved.storeId) });
    },
  });
}
