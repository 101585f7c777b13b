import { authKeys } from "../features/auth/api/auth-keys";
import { createQueryClient } from "../lib/query-client";

/** The app's query client: a lost session or stale CSRF token makes it re-read the session. */
export function createAppQueryClient() {
  const client = createQueryClient({
    onSessionDoubt: () => void client.invalidateQueries({ queryKey: authKeys.session() }),
  });
  return client;
}
