import { useMutation, useQueryClient } from "@tanstack/react-query";
import { store } from "#core/contracts/stores";
import { api } from "../../../lib/api-client";
import { invalidateEntity } from "../../../entities/invalidate";

/** Archiving hides a store from the list but keeps its plans, sweeps and records; it can be undone. */
export function setStoreArchived({ id, archived }: { id: string; archived: boolean }) {
  return api.post(`/api/stores/${id}/${archived ? "archive" : "unarchive"}`, store);
}

export function useSetStoreArchived() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setStoreArchived,
    onSuccess: () => invalidateEntity(queryClient, "store"),
  });
}
