import { useMemo, useRef } from "react";
import { Navigate, useLocation } from "react-router";
import { Spinner } from "../../components/ui/spinner";
import { QueryError } from "../../components/ui/query-error";
import { useSession } from "../../features/auth/api/get-session";
import { activeMembership } from "../../features/auth/model/active-membership";
import { AppShell } from "./app-shell";
import { NoCompany } from "./no-company";
import { SignedInContext } from "./session-context";
import { signInPath } from "./safe-next";
import { SignOutIntentContext } from "./sign-out-intent";

/** Signed-out people go to sign-in and come back here afterwards. */
export function RequireSession() {
  const location = useLocation();
  const session = useSession();
  const signingOut = useRef(false);
  const intent = useMemo(
    () => ({
      begin: () => {
        signingOut.current = true;
      },
      cancel: () => {
        signingOut.current = false;
      },
    }),
    [],
  );
  const data = session.data;
  const membership = data ? activeMembership(data) : null;
  const value = useMemo(
    () => (data?.user && membership ? { session: data, user: data.user, membership } : null),
    [data, membership],
  );

  if (session.isPending) return <Spinner label="Opening Plumeline…" />;
  if (session.isError && !data) {
    return (
      <main className="mx-auto max-w-xl p-4">
        <QueryError error={session.error} what="your session" onRetry={() => void session.refetch()} />
      </main>
    );
  }
  if (!data?.user) {
    const to = signingOut.current ? "/sign-in" : signInPath(location.pathname + location.search);
    return <Navigate to={to} replace />;
  }
  return (
    <SignOutIntentContext.Provider value={intent}>
      {value ? (
        <SignedInContext.Provider value={value}>
          <AppShell />
        </SignedInContext.Provider>
      ) : (
        <NoCompany />
      )}
    </SignOutIntentContext.Provider>
  );
}
