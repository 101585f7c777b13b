import type { NumberFormat } from "#core/domain/numbers/number-format";
import { Link } from "react-router";
import { countOf } from "../../../lib/format";
import { QueryError } from "../../../components/ui/query-error";
import { Spinner } from "../../../components/ui/spinner";
import { useSweeps as useStoreSweeps } from "../../../entities/sweeps/sweeps-api";
import { formatInZone } from "#core/domain/dates/format-in-zone";
import { useSweepSummary } from "../api/get-sweep-summary";
import { SweepSummaryPlot } from "./sweep-summary-plot";

const LINK = "inline-flex min-h-11 items-center rounded-md px-4 font-bold no-underline";

/** The store page's sweeps section: the latest few with their field maps (starting one is in the page header). */
export function StoreSweepsSection(p: {
  storeId: string;
  timeZone: string;
  canCompare: boolean;
  /** The company's number format. */
  numberFormat: NumberFormat;
}) {
  const { storeId, timeZone } = p;
  const sweeps = useStoreSweeps(storeId);
  const summary = useSweepSummary(storeId);
  const when = (iso: string) => formatInZone(iso, timeZone);
  const latest = [...(sweeps.data ?? [])].sort((a, b) => b.startedAt.localeCompare(a.startedAt)).slice(0, 3);
  return (
    <section aria-labelledby="store-sweeps" className="space-y-3">
      <h2 id="store-sweeps" className="text-xl font-bold">
        Sweeps
      </h2>
      {sweeps.isPending ? <Spinner label="Loading sweeps…" /> : null}
      {sweeps.isError ? (
        <QueryError error={sweeps.error} what="the sweeps" onRetry={() => void sweeps.refetch()} />
      ) : null}
      {sweeps.data && latest.length === 0 ? <p className="text-muted">No sweeps of this store yet.</p> : null}
      {latest.length ? (
        <ul className="space-y-1">
          {latest.map((s) => (
            <li key={s.id}>
              <Link className="text-accent underline" to={`/stores/${storeId}/sweeps/${s.id}/map`}>
                {when(s.startedAt)}
              </Link>
              <span className="text-muted">
                {" "}
                · {s.technicianName} · {countOf(s.readingCount, "reading")} · {s.status.replace("-", " ")}
              </span>
            </li>
          ))}
        </ul>
      ) : null}
      {summary.data?.length ? (
        <SweepSummaryPlot sweeps={summary.data} timeZone={timeZone} numberFormat={p.numberFormat} />
      ) : null}
      <div className="flex flex-wrap gap-2">
        {sweeps.data?.length ? (
          <Link className={`${LINK} edge bg-surface`} to={`/stores/${storeId}/sweeps`}>
            All sweeps
          </Link>
        ) : null}
        {p.canCompare && (sweeps.data?.length ?? 0) > 1 ? (
          <Link className={`${LINK} edge bg-surface`} to={`/stores/${storeId}/compare`}>
            Compare months
          </Link>
        ) : null}
      </div>
    </section>
  );
}
