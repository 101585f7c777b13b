import { queryOptions, useQuery } from "@tanstack/react-query";
import { teamResponse } from "#core/contracts/members";
import { api } from "../../../lib/api-client";
import { anyQueued, MAIL_REFRESH_MS } from "../../../components/mail-delivery-status";
import { teamKeys } from "./team-keys";

export function getTeam(signal?: AbortSignal) {
  return api.get("/api/team", teamResponse, signal);
}

export function teamQueryOptions() {
  return queryOptions({
    queryKey: teamKeys.list(),
    queryFn: ({ signal }) => getTeam(signal),
    // An invitation e-mail still queued: look again until it is sent or has failed.
    refetchInterval: (q) => (anyQueued(q.state.data?.invitations) ? MAIL_REFRESH_MS : false),
  });
}

export function useTeam(options: { enabled?: boolean } = {}) {
  return useQuery({ ...teamQueryOptions(), enabled: options.enabled ?? true });
}
