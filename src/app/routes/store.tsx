import { Link, useParams } from "react-router";
import { can } from "#core/domain/roles";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { useStore } from "../../entities/stores/stores-api";
import { StoreSummary } from "../../features/stores/components/store-summary";
import { ResumeSweeps } from "../../features/walk/components/resume-sweeps";
import { StartSweepLink } from "../../features/walk/components/start-sweep-link";
import { useKeepStoreOnDevice } from "../../features/walk/hooks/use-keep-store-on-device";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";
import { useUnitPreferences } from "../shell/use-unit-preferences";
import { STORE_SECTIONS } from "./store-sections";

export function Component() {
  const { storeId = "" } = useParams();
  const { membership, user } = useSignedIn();
  const units = useUnitPreferences();
  const store = useStore(storeId);
  const records = can(membership.role, "sweeps.record");
  useKeepStoreOnDevice(storeId, records);
  useDocumentTitle(store.data?.name ?? "Store");

  if (store.isPending) return <Spinner label="Loading the store…" />;
  if (store.isError) return <QueryError error={store.error} what="the store" onRetry={() => void store.refetch()} />;
  const s = store.data;
  return (
    <>
      <p className="mb-2">
        <Link to="/" className="inline-flex min-h-11 items-center">
          ← All stores
        </Link>
      </p>
      <PageHeader
        title={s.name}
        description={s.archivedAt ? "Archived store" : undefined}
        actions={records && !s.archivedAt ? <StartSweepLink storeId={s.id} /> : undefined}
      />
      {records && !s.archivedAt ? <ResumeSweeps userId={user.id} storeId={s.id} /> : null}
      <div className="space-y-10">
        <StoreSummary store={s} canEdit={can(membership.role, "stores.edit")} />
        {STORE_SECTIONS.map(({ id, Component: Section }) => (
          <Section key={id} store={s} role={membership.role} units={units} />
        ))}
      </div>
    </>
  );
}
