import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import { member, memberUpdateInput } from "#core/contracts/members";
import { api } from "../../../lib/api-client";
import { teamKeys } from "./team-keys";

export { memberUpdateInput };

export interface UpdateMemberVariables {
  membershipId: string;
  input: z.input<typeof memberUpdateInput>;
}

export function updateMember({ membershipId, input }: UpdateMemberVariables) {
  return api.patch(`/api/team/members/${encodeURIComponent(membershipId)}`, member, input);
}

export function useUpdateMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMember,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.lists() }),
  });
}
