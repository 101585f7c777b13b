import { useMutation, useQueryClient } from "@tanstack/react-query";
import { store } from "#core/contracts/stores";
import { api } from "../../../lib/api-client";
import { storesKeys } from "./stores-keys";

/** Archiving hides a store from the list but keeps its plans, sweeps and records; it can be undone. */
export function setStoreArchived({ id, archived }: { id: string; archived: boolean }) {
  return api.post(`/api/stores/${id}/${archived ? "archive" : "unarchive"}`, store);
}

export function useSetStoreArchived() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setStoreArchived,
    onSuccess: (saved) => {
      queryClient.setQueryData(storesKeys.detail(saved.id), saved);
      return queryClient.invalidateQueries({ queryKey: storesKeys.lists() });
    },
  });
}
