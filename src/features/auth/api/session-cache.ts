import type { QueryClient } from "@tanstack/react-query";
import type { SessionInfo } from "#core/contracts/auth";
import { authKeys } from "./auth-keys";
import { rememberSession } from "./offline-session";

const notAuth = (query: { queryKey: readonly unknown[] }) => query.queryKey[0] !== authKeys.all[0];

/**
 * A new person (sign-in, sign-out, accepted invitation): every cached answer belonged to the
 * previous session, so all of it goes; only the new session stays.
 */
export function replaceSession(queryClient: QueryClient, info: SessionInfo): void {
  rememberSession(info);
  queryClient.setQueryData(authKeys.session(), info);
  queryClient.removeQueries({ predicate: notAuth });
}

/**
 * Same person, another company: cached answers are the other company's data. Reset them, so
 * nothing of it stays on screen, and let the open pages load again for the new company.
 */
export function switchSession(queryClient: QueryClient, info: SessionInfo): Promise<void> {
  rememberSession(info);
  queryClient.setQueryData(authKeys.session(), info);
  return queryClient.resetQueries({ predicate: notAuth });
}

/** Same person, same company, new details (a profile edit): keep the other caches. */
export function updateSession(queryClient: QueryClient, info: SessionInfo): void {
  rememberSession(info);
  queryClient.setQueryData(authKeys.session(), info);
}
