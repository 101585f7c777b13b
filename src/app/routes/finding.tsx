import { Link, useParams } from "react-router";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { localDateOf } from "#core/domain/dates/time-zone";
import { can } from "#core/domain/roles";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { useFinding } from "../../entities/findings/findings-api";
import { FindingActions } from "../../features/findings/components/finding-actions";
import { FindingView } from "../../features/findings/components/finding-view";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";
import { useUnitPreferences } from "../shell/use-unit-preferences";

export function Component() {
  const { findingId = "" } = useParams();
  const { membership } = useSignedIn();
  const finding = useFinding(findingId);
  const units = useUnitPreferences();
  useDocumentTitle("Finding");
  if (finding.isPending) return <Spinner label="Loading the finding…" />;
  if (finding.isError)
    return <QueryError error={finding.error} what="the finding" onRetry={() => void finding.refetch()} />;
  const f = finding.data;
  return (
    <>
      <PageHeader
        title={`Finding: ${f.systemName ?? "no system"}`}
        description={
          <>
            {f.storeName} · found {formatCalendarDay(f.events[0]?.on ?? null)} by {f.foundBy}
            {f.systemId ? (
              <>
                {" "}
                ·{" "}
                <Link className="text-accent underline" to={`/systems/${f.systemId}`}>
                  system records
                </Link>
              </>
            ) : null}
          </>
        }
      />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <FindingView finding={f} canAddPhoto={can(membership.role, "findings.record")} lengthUnit={units.length} />
        <div>
          <FindingActions
            key={f.events.length}
            finding={f}
            role={membership.role}
            today={localDateOf(new Date(), f.timeZone)}
          />
        </div>
      </div>
    </>
  );
}
