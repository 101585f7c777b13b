import { useMutation, useQueryClient } from "@tanstack/react-query";
import { systemRemoval, type RetireInput } from "#core/contracts/systems";
import { api } from "../../../lib/api-client";
import { invalidateEntity } from "../../../entities/invalidate";

/** Retires a system on the day it left service, with the reason; its records stay (decision 0124). */
export function retireSystem({ id, input }: { id: string; input: RetireInput }) {
  return api.post(`/api/systems/${id}/retire`, systemRemoval, input);
}

export function useRetireSystem() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: retireSystem,
    onSuccess: () => invalidateEntity(queryClient, "system"),
  });
}
