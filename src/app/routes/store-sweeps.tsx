import { Link, useParams } from "react-router";
import { countOf } from "../../lib/format";
import { EmptyState } from "../../components/ui/empty-state";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { useStores } from "../../entities/stores/stores-api";
import { useSweeps as useStoreSweeps } from "../../entities/sweeps/sweeps-api";
import { useDocumentTitle } from "../../lib/use-document-title";
import { formatInZone } from "#core/domain/dates/format-in-zone";
import { can } from "#core/domain/roles";
import { useSignedIn } from "../shell/session-context";

/** A store's sweeps, newest first, each opening its field map (a store contact: its report, decision 0072). */
export function Component() {
  const { storeId = "" } = useParams();
  const { membership } = useSignedIn();
  const evidence = can(membership.role, "sweeps.read");
  const sweeps = useStoreSweeps(storeId);
  const stores = useStores();
  const store = stores.data?.find((s) => s.id === storeId);
  useDocumentTitle(store ? `Sweeps · ${store.name}` : "Sweeps");
  const tz = store?.timeZone ?? "UTC";
  const when = (iso: string) => formatInZone(iso, tz);
  if (sweeps.isError)
    return <QueryError error={sweeps.error} what="the sweeps" onRetry={() => void sweeps.refetch()} />;
  if (!sweeps.data) return <Spinner label="Loading sweeps…" />;
  const list = [...sweeps.data].sort((a, b) => b.startedAt.localeCompare(a.startedAt));
  return (
    <>
      <PageHeader
        title={`Sweeps — ${store?.name ?? "store"}`}
        actions={
          evidence && list.length > 1 ? (
            <Link
              className="inline-flex min-h-11 items-center rounded-md edge bg-surface px-4 font-bold no-underline"
              to={`/stores/${storeId}/compare`}
            >
              Compare months
            </Link>
          ) : null
        }
      />
      {list.length === 0 ? <EmptyState title="No sweeps yet" /> : null}
      <ul className="space-y-2">
        {list.map((s) => (
          <li
            key={s.id}
            className="flex flex-wrap items-center justify-between gap-2 rounded-md edge bg-surface p-3"
            data-testid="sweep-row"
          >
            <div>
              <p className="font-bold">{when(s.startedAt)}</p>
              <p className="text-sm text-muted">
                {s.technicianName} · {s.detectorName} · fans {s.fans} · {countOf(s.readingCount, "reading")} ·{" "}
                {s.status.replace("-", " ")}
              </p>
            </div>
            <Link
              className="inline-flex min-h-11 items-center rounded-md bg-accent px-4 font-bold text-on-accent no-underline"
              to={`/stores/${storeId}/sweeps/${s.id}/map`}
            >
              {evidence ? "Open field map" : "Open report"}
            </Link>
          </li>
        ))}
      </ul>
    </>
  );
}
