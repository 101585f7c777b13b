import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { accountSessions } from "#core/contracts/auth";
import { api } from "../../../lib/api-client";
import { accountKeys } from "./account-keys";

export function getAccountSessions(signal?: AbortSignal) {
  return api.get("/api/profile/sessions", accountSessions, signal);
}

export function useAccountSessions() {
  return useQuery(
    queryOptions({ queryKey: accountKeys.sessions(), queryFn: ({ signal }) => getAccountSessions(signal) }),
  );
}

/** Signs one of your other devices out (by the session's public id). */
export function useEndSession() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.delete(`/api/profile/sessions/${encodeURIComponent(id)}`),
    onSettled: () => queryClient.invalidateQueries({ queryKey: accountKeys.sessions() }),
  });
}

/** Signs every other device out; this one stays signed in. */
export function useEndOtherSessions() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post("/api/profile/sessions/end-others", null),
    onSettled: () => queryClient.invalidateQueries({ queryKey: accountKeys.sessions() }),
  });
}
