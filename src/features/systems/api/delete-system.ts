import { useMutation, useQueryClient } from "@tanstack/react-query";
import { systemRemoval } from "#core/contracts/systems";
import { api } from "../../../lib/api-client";
import { invalidateEntity } from "../../../entities/invalidate";

/** Deletes a system without records; one with records is retired and its records stay (the answer says which). */
export function deleteSystem({ id }: { id: string; storeId: string }) {
  return api.deleteWithAnswer(`/api/systems/${id}`, systemRemoval);
}

export function useDeleteSystem() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteSystem,
    onSuccess: () => invalidateEntity(queryClient, "system"),
  });
}
