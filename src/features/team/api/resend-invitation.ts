import { useMutation, useQueryClient } from "@tanstack/react-query";
import { invitation } from "#core/contracts/members";
import { api } from "../../../lib/api-client";
import { teamKeys } from "./team-keys";

/** Sends the invitation again: the same invitation, never a second one. */
export function resendInvitation(invitationId: string) {
  return api.post(`/api/team/invitations/${encodeURIComponent(invitationId)}/resend`, invitation);
}

export function useResendInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resendInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.lists() }),
  });
}
