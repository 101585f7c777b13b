import { Link, useNavigate, useParams } from "react-router";
import { can } from "#core/domain/roles";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { useStores } from "../../entities/stores/stores-api";
import { ResumeSweeps } from "../../features/walk/components/resume-sweeps";
import { StartSweepForm } from "../../features/walk/components/start-sweep-form";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";
import { Component as NotFound } from "./not-found";

/** /walk picks a store; /stores/:storeId/walk starts a sweep of it. */
export function Component() {
  useDocumentTitle("Start a sweep");
  const { storeId } = useParams();
  const navigate = useNavigate();
  const { membership, user } = useSignedIn();
  const stores = useStores({}, { enabled: !storeId });
  if (!can(membership.role, "sweeps.record")) return <NotFound />;
  if (!storeId) {
    return (
      <>
        <PageHeader
          title="Walk"
          description="Choose the store to sweep. Its plan is kept on this device, so the sweep works without a connection."
        />
        <ResumeSweeps userId={user.id} storeNames={new Map((stores.data ?? []).map((s) => [s.id, s.name]))} />
        {stores.isPending ? <Spinner label="Loading stores…" /> : null}
        {stores.isError ? (
          <QueryError error={stores.error} what="the stores" onRetry={() => void stores.refetch()} />
        ) : null}
        <ul className="grid gap-3 sm:grid-cols-2">
          {(stores.data ?? [])
            .filter((s) => !s.archivedAt)
            .map((s) => (
              <li key={s.id}>
                <Link
                  to={`/stores/${s.id}/walk`}
                  className="flex min-h-14 items-center rounded-md bg-surface p-4 text-lg font-bold edge"
                >
                  {s.name}
                </Link>
              </li>
            ))}
        </ul>
      </>
    );
  }
  return (
    <>
      <PageHeader title="Start a sweep" />
      <ResumeSweeps userId={user.id} storeId={storeId} />
      <StartSweepForm storeId={storeId} onStarted={(id) => navigate(`/stores/${storeId}/walk/${id}`)} />
    </>
  );
}
