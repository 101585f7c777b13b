import { useMutation, useQueryClient } from "@tanstack/react-query";
import { system, type RevisionInput } from "#core/contracts/systems";
import { api } from "../../../lib/api-client";
import { invalidateEntity } from "../../../entities/invalidate";

/** POST /api/systems/:id/revisions: a dated change of the facts the rules read (docs/decisions/0043). */
export function addRevision({ id, input }: { id: string; input: RevisionInput }) {
  return api.post(`/api/systems/${id}/revisions`, system, input);
}

export function useAddRevision() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addRevision,
    onSuccess: () => invalidateEntity(queryClient, "system"),
  });
}
