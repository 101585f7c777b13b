import { useMutation, useQueryClient } from "@tanstack/react-query";
import { system, systemInput, type SystemInput } from "#core/contracts/systems";
import { api } from "../../../lib/api-client";
import { invalidateEntity } from "../../../entities/invalidate";

export const createSystemInput = systemInput;

export function createSystem({ storeId, input }: { storeId: string; input: SystemInput }) {
  return api.post(`/api/stores/${storeId}/systems`, system, input);
}

export function useCreateSystem() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createSystem,
    onSuccess: () => invalidateEntity(queryClient, "system"),
  });
}
