import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { teamKeys } from "./team-keys";

export function revokeInvitation(invitationId: string): Promise<void> {
  return api.delete(`/api/team/invitations/${encodeURIComponent(invitationId)}`);
}

export function useRevokeInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.lists() }),
  });
}
