import { useNavigate, useParams } from "react-router";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { COMPONENT_LABELS } from "#core/contracts/findings";
import { can } from "#core/domain/roles";
import { findingStateWords } from "#core/domain/findings/left-service";
import { ACTION_LABELS } from "#core/domain/findings/lifecycle";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { useFindings } from "../../entities/findings/findings-api";
import { useSystemRecords } from "../../entities/records/records-api";
import { SystemRecords } from "../../features/compliance/components/system-records-view";
import { AcceptedReadings } from "../../features/compliance/components/accepted-readings";
import { NewFindingForm } from "../../features/findings/components/new-finding-form";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";
import { useUnitPreferences } from "../shell/use-unit-preferences";
import { Link } from "react-router";
import { useScrollToHash } from "../../lib/use-scroll-to-hash";

// Where the compliance records of a system meet its findings.
export function Component() {
  const { systemId = "" } = useParams();
  const { membership } = useSignedIn();
  const records = useSystemRecords(systemId);
  const findings = useFindings(records.data?.store.id, systemId);
  const navigate = useNavigate();
  useDocumentTitle(records.data ? records.data.system.name : "System records");
  const { mass: unit, number: numberFormat } = useUnitPreferences();
  const canRecord = can(membership.role, "findings.record");
  useScrollToHash(!!records.data && !findings.isPending);
  if (records.isPending) return <Spinner label="Loading the system's records…" />;
  if (records.isError)
    return <QueryError error={records.error} what="the system's records" onRetry={() => void records.refetch()} />;
  const r = records.data;
  const list = findings.data ?? [];
  return (
    <>
      <PageHeader
        title={r.system.name}
        description={`${r.store.name} · records on the store's calendar (${r.store.timeZone}); today is ${formatCalendarDay(r.today)}.`}
      />
      <div className="space-y-8">
        <AcceptedReadings>
          <SystemRecords
            r={r}
            unit={unit}
            numberFormat={numberFormat}
            canRecord={canRecord}
            canFile={can(membership.role, "compliance.manage")}
            findings={list
              .filter((f) => f.status !== "dismissed")
              .map((f) => ({
                id: f.id,
                label: `${formatCalendarDay(f.events[0]?.on ?? null)} ${f.component ? COMPONENT_LABELS[f.component] : "leak"} (${f.status})`,
              }))}
          />
        </AcceptedReadings>
        <section aria-labelledby="sys-findings" className="space-y-3">
          <h2 id="sys-findings" className="text-xl font-bold">
            Findings on this system
          </h2>
          {list.length === 0 ? (
            <p className="text-muted">No findings.</p>
          ) : (
            <ul className="space-y-1">
              {list.map((f) => (
                <li key={f.id}>
                  <Link className="text-accent underline" to={`/findings/${f.id}`}>
                    {formatCalendarDay(f.events[0]?.on ?? null)} ·{" "}
                    {f.component ? COMPONENT_LABELS[f.component] : "component not yet known"} · {findingStateWords(f)}
                  </Link>
                  {f.deadlines[0] ? ` · due ${formatCalendarDay(f.deadlines[0].dueOn)}` : ""}
                </li>
              ))}
            </ul>
          )}
          {r.system.retired && list.some((f) => f.nextActions.includes("close-left-service")) ? (
            <p data-testid="left-service-open">
              Still open on a system out of service: an engineer or owner closes each with "
              {ACTION_LABELS["close-left-service"]}" on its page. Nothing more is owed on them.
            </p>
          ) : null}
          {canRecord && r.system.retired ? (
            // A system out of service takes no new entry (docs/decisions/0124); its findings stay listed.
            <p className="text-muted">Out of service: no new finding is recorded against it.</p>
          ) : canRecord ? (
            <NewFindingForm
              storeId={r.store.id}
              systemId={r.system.id}
              today={r.today}
              timeZone={r.store.timeZone}
              onCreated={(id) => navigate(`/findings/${id}`)}
            />
          ) : null}
        </section>
      </div>
    </>
  );
}
