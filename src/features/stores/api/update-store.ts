import { useMutation, useQueryClient } from "@tanstack/react-query";
import { store, storeUpdateInput, type StoreUpdateInput } from "#core/contracts/stores";
import { api } from "../../../lib/api-client";
import { invalidateEntity } from "../../../entities/invalidate";

export const updateStoreInput = storeUpdateInput;

export function updateStore({ id, input }: { id: string; input: StoreUpdateInput }) {
  return api.patch(`/api/stores/${id}`, store, input);
}

export function useUpdateStore() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateStore,
    onSuccess: () => invalidateEntity(queryClient, "store"),
  });
}
