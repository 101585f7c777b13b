import { useMutation, useQueryClient } from "@tanstack/react-query";
import { invitation, inviteInput, type InviteInput } from "#core/contracts/members";
import { api } from "../../../lib/api-client";
import { teamKeys } from "./team-keys";

export { inviteInput };

export function inviteMember(input: InviteInput) {
  return api.post("/api/team/invitations", invitation, input);
}

export function useInviteMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: inviteMember,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.lists() }),
  });
}
