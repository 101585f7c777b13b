import { queryOptions, useQuery } from "@tanstack/react-query";
import { sessionInfo, type SessionInfo } from "../../../../server/contracts/auth";
import { api } from "../../../lib/api-client";
import { authKeys } from "./auth-keys";

export function getSession(signal?: AbortSignal): Promise<SessionInfo> {
  return api.get("/api/auth/session", sessionInfo, signal);
}

export function sessionQueryOptions() {
  return queryOptions({
    queryKey: authKeys.session(),
    queryFn: ({ signal }) => getSession(signal),
    // The session only changes through our own calls, which write the cache themselves.
    staleTime: 5 * 60_000,
  });
}

export function useSession() {
  return useQuery(sessionQueryOptions());
}
