import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { teamKeys } from "./team-keys";

export function removeMember(membershipId: string): Promise<void> {
  return api.delete(`/api/team/members/${encodeURIComponent(membershipId)}`);
}

export function useRemoveMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeMember,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.lists() }),
  });
}
