import { MutationCache, QueryCache, QueryClient } from "@tanstack/react-query";
import { isApiRequestError } from "./api-client";

// Client errors (4xx) will not fix themselves on retry; network and 5xx errors get one more try.
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiRequestError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 1;
}

export interface QueryClientHooks {
  /**
   * Called when a call finds the session gone (expired, signed out in another tab) or its CSRF
   * token stale; the app then re-reads the session, which sends a signed-out person to sign-in
   * and gives the next request a fresh token.
   */
  onSessionDoubt?: () => void;
}

function isSessionDoubt(error: unknown): boolean {
  return isApiRequestError(error) && (error.code === "not_signed_in" || error.code === "csrf_failed");
}

export function createQueryClient(hooks: QueryClientHooks = {}): QueryClient {
  const onError = (error: unknown) => {
    if (isSessionDoubt(error)) hooks.onSessionDoubt?.();
  };
  return new QueryClient({
    queryCache: new QueryCache({ onError }),
    mutationCache: new MutationCache({ onError }),
    defaultOptions: {
      queries: { retry: shouldRetry, staleTime: 30_000, refetchOnWindowFocus: false },
      mutations: { retry: false },
    },
  });
}
