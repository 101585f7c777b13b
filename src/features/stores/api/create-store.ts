import { useMutation, useQueryClient } from "@tanstack/react-query";
import { store, storeInput, type StoreInput } from "#core/contracts/stores";
import { api } from "../../../lib/api-client";
import { invalidateEntity } from "../../../entities/invalidate";

export const createStoreInput = storeInput;

export function createStore(input: StoreInput) {
  return api.post("/api/stores", store, input);
}

export function useCreateStore() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createStore,
    onSuccess: () => invalidateEntity(queryClient, "store"),
  });
}
