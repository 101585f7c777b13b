import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import { sessionInfo, type SessionInfo } from "#core/contracts/auth";
import { acceptInvitationInput, newAccountPassword } from "#core/contracts/members";
import { api } from "../../../lib/api-client";
import { replaceSession } from "./session-cache";

export { acceptInvitationInput, newAccountPassword };

export interface AcceptInvitationVariables {
  token: string;
  input: z.infer<typeof acceptInvitationInput>;
}

export function acceptInvitation({ token, input }: AcceptInvitationVariables): Promise<SessionInfo> {
  return api.post(`/api/invitations/${encodeURIComponent(token)}/accept`, sessionInfo, input);
}

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: (info) => replaceSession(queryClient, info),
  });
}
