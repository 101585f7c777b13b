import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { invalidateEntity } from "../../../entities/invalidate";

export function deleteSystem({ id }: { id: string; storeId: string }) {
  return api.delete(`/api/systems/${id}`);
}

export function useDeleteSystem() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteSystem,
    onSuccess: () => invalidateEntity(queryClient, "system"),
  });
}
