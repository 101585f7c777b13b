import { queryOptions, useQuery } from "@tanstack/react-query";
import { sessionInfo, type SessionInfo } from "#core/contracts/auth";
import { api, isApiRequestError } from "../../../lib/api-client";
import { authKeys } from "./auth-keys";
import { lastKnownSession, rememberSession } from "./offline-session";

/** The session; without a connection, the last one the server confirmed on this device. */
export async function getSession(signal?: AbortSignal): Promise<SessionInfo> {
  try {
    const info = await api.get("/api/auth/session", sessionInfo, signal);
    rememberSession(info);
    return info;
  } catch (e) {
    const cached = isApiRequestError(e) && e.code === "network" ? lastKnownSession() : null;
    if (cached) return cached;
    throw e;
  }
}

export function sessionQueryOptions() {
  return queryOptions({
    queryKey: authKeys.session(),
    queryFn: ({ signal }) => getSession(signal),
    // The session only changes through our own calls, which write the cache themselves.
    staleTime: 5 * 60_000,
    // Without a connection getSession answers from the device (the Walk screen opens offline), so
    // the read must run even after the browser said it is offline; only its retries wait.
    networkMode: "offlineFirst",
  });
}

export function useSession() {
  return useQuery(sessionQueryOptions());
}
