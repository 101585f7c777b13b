import { Link, useParams } from "react-router";
import { COMPONENT_LABELS } from "#core/contracts/findings";
import { formatInZone } from "#core/domain/dates/format-in-zone";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { useFindings } from "../../entities/findings/findings-api";
import { useStores } from "../../entities/stores/stores-api";
import { useSweep } from "../../entities/sweeps/sweeps-api";
import { useDocumentTitle } from "../../lib/use-document-title";

/**
 * A store contact's view of one sweep: when it was walked, what was found, and the report the service
 * team sends. The readings and field map behind it stay with the team (decision 0072).
 */
export function SweepReportPage() {
  const { storeId = "", sweepId = "" } = useParams();
  const sweep = useSweep(sweepId);
  const stores = useStores();
  const findings = useFindings(storeId);
  const store = stores.data?.find((s) => s.id === storeId);
  useDocumentTitle(store ? `Sweep report · ${store.name}` : "Sweep report");
  if (sweep.isError) return <QueryError error={sweep.error} what="the sweep" onRetry={() => void sweep.refetch()} />;
  if (!sweep.data) return <Spinner label="Loading the sweep…" />;
  const s = sweep.data;
  const timeZone = store?.timeZone ?? "UTC";
  const found = (findings.data ?? []).filter((f) => f.sweepId === sweepId);
  return (
    <>
      <p className="mb-2">
        <Link to={`/stores/${storeId}/sweeps`} className="inline-flex min-h-11 items-center">
          ← Sweeps
        </Link>
      </p>
      <PageHeader
        title={`Sweep of ${formatInZone(s.startedAt, timeZone)}`}
        description={`Walked by ${s.technicianName}. ${s.submittedAt ? "Submitted." : "Still in progress."}`}
      />
      <section aria-labelledby="sweep-findings" className="space-y-3">
        <h2 id="sweep-findings" className="text-xl font-bold">
          Leaks found on this sweep
        </h2>
        {found.length === 0 ? (
          <p>No leak was recorded on this sweep.</p>
        ) : (
          <ul className="space-y-2">
            {found.map((f) => (
              <li key={f.id}>
                <Link to={`/findings/${f.id}`}>
                  {f.fixtureLabel ?? "On the plan"}
                  {f.component ? ` · ${COMPONENT_LABELS[f.component]}` : ""}
                </Link>{" "}
                <span className="text-muted">({f.status})</span>
              </li>
            ))}
          </ul>
        )}
        <a
          className="inline-flex min-h-11 items-center rounded-md bg-accent px-4 font-bold text-on-accent no-underline"
          href={`/api/sweeps/${sweepId}/report.pdf`}
          download
        >
          Download the report (PDF)
        </a>
      </section>
    </>
  );
}
