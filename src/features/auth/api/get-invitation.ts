import { queryOptions, useQuery } from "@tanstack/react-query";
import { invitationPreview } from "#core/contracts/members";
import { api } from "../../../lib/api-client";
import { authKeys } from "./auth-keys";

export function getInvitation(token: string, signal?: AbortSignal) {
  return api.get(`/api/invitations/${encodeURIComponent(token)}`, invitationPreview, signal);
}

export function invitationQueryOptions(token: string) {
  return queryOptions({
    queryKey: authKeys.invitation(token),
    queryFn: ({ signal }) => getInvitation(token, signal),
  });
}

export function useInvitation(token: string) {
  return useQuery(invitationQueryOptions(token));
}
