import { Link } from "react-router";
import { findingStateWords } from "#core/domain/findings/left-service";
import type { FindingStatus } from "#core/domain/findings/lifecycle";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { COMPONENT_LABELS, type FINDING_COMPONENTS } from "#core/contracts/findings";
import { QueryError } from "../../../components/ui/query-error";
import { Spinner } from "../../../components/ui/spinner";
import { useToday } from "../../../entities/records/records-api";
import type { NumberFormat } from "#core/domain/numbers/number-format";
import { daysInWords, formatPercent, STATE_LABELS } from "../model/figures";

/** The store page's records section: each system's latest leak rate, what is due, open findings. */
export function StoreRecordsSection({ storeId, numberFormat }: { storeId: string; numberFormat: NumberFormat }) {
  const today = useToday(storeId);
  return (
    <section aria-labelledby="store-records" className="space-y-3">
      <h2 id="store-records" className="text-xl font-bold">
        Leak records
      </h2>
      {today.isPending ? <Spinner label="Loading the records…" /> : null}
      {today.isError ? (
        <QueryError error={today.error} what="the records" onRetry={() => void today.refetch()} />
      ) : null}
      {today.data ? (
        <div className="grid gap-4 lg:grid-cols-3">
          <div>
            <h3 className="font-bold">Systems</h3>
            <ul className="space-y-1">
              {today.data.systems.map((s) => (
                <li key={s.id}>
                  <Link className="text-accent underline" to={s.link}>
                    {s.name}
                  </Link>
                  :{" "}
                  {today.data.wording === "eu" ? (
                    // EU F-gas: leak checks by CO2-equivalent, no leak rate or threshold to show.
                    s.nextInspection ? (
                      `next leak check ${formatCalendarDay(s.nextInspection)}`
                    ) : (
                      "no periodic leak check"
                    )
                  ) : (
                    <>
                      <span className={s.breachOpen ? "font-bold text-danger" : ""}>
                        {s.latestPercent === null ? "no additions" : formatPercent(s.latestPercent, numberFormat)}
                      </span>
                      {s.thresholdPercent !== null ? ` (threshold ${s.thresholdPercent} %)` : " (no threshold applies)"}
                    </>
                  )}
                </li>
              ))}
            </ul>
          </div>
          <div>
            <h3 className="font-bold">Due</h3>
            {today.data.due.length === 0 ? (
              <p className="text-muted">Nothing due.</p>
            ) : (
              <ul className="space-y-1">
                {today.data.due.map((d) => (
                  <li key={`${d.kind}-${d.systemId}-${d.findingId}-${d.dueOn}`}>
                    <span className="font-bold">{formatCalendarDay(d.dueOn)}</span> (
                    {STATE_LABELS[d.state].toLowerCase()}, {daysInWords(d.daysLeft)}):{" "}
                    <Link className="text-accent underline" to={d.link}>
                      {/* A store has several systems: each item says whose it is. */}
                      {d.systemName ? `${d.systemName}: ` : ""}
                      {d.what}
                    </Link>
                  </li>
                ))}
              </ul>
            )}
          </div>
          <div>
            <h3 className="font-bold">Open findings</h3>
            {today.data.openFindings.length === 0 ? (
              <p className="text-muted">None.</p>
            ) : (
              <ul className="space-y-1">
                {today.data.openFindings.map((f) => (
                  <li key={f.id}>
                    <Link className="text-accent underline" to={f.link}>
                      {f.component ? COMPONENT_LABELS[f.component as (typeof FINDING_COMPONENTS)[number]] : "Leak"} on{" "}
                      {f.systemName ?? "no system"}
                    </Link>{" "}
                    ·{" "}
                    {findingStateWords({
                      status: f.status as FindingStatus,
                      events: [],
                      systemRetiredOn: f.systemRetiredOn,
                    })}
                    {f.deadline ? ` · due ${formatCalendarDay(f.deadline)}` : ""}
                  </li>
                ))}
              </ul>
            )}
          </div>
        </div>
      ) : null}
    </section>
  );
}
