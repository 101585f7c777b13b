import { Link } from "react-router";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import type { FindingDetail } from "#core/contracts/finding-actions";
import { COMPONENT_LABELS, FINDING_EVENT_LABELS } from "#core/contracts/findings";
import { Alert } from "../../../components/ui/alert";
import { Cautions } from "../../../components/ui/cautions";
import { formErrorMessage } from "../../../lib/form-errors";
import { useChangeFinding } from "../api/change-finding";
import { SourceText } from "../../../components/ui/source-text";
import { formatLength, type LengthPreference } from "#core/domain/units/format-units";
import { findingStateWords } from "#core/domain/findings/left-service";

/** A finding: where and what, its deadlines with their rules, the signed history and photos. */
export function FindingView({
  finding,
  canAddPhoto,
  lengthUnit = "m",
}: {
  finding: FindingDetail;
  canAddPhoto: boolean;
  lengthUnit?: LengthPreference;
}) {
  const len = (m: number) => formatLength(m, lengthUnit, { decimals: 1 });
  const upload = useChangeFinding();
  const message = formErrorMessage(upload.error);
  return (
    <div className="space-y-6">
      <dl className="grid gap-3 sm:grid-cols-3">
        <div className="rounded-md bg-surface p-3 edge">
          <dt className="text-sm text-muted">Status</dt>
          <dd className="font-bold" data-testid="finding-status">
            {findingStateWords(finding)}
            {finding.dismissReason ? ` (${finding.dismissReason})` : ""}
          </dd>
        </div>
        <div className="rounded-md bg-surface p-3 edge">
          <dt className="text-sm text-muted">Component</dt>
          <dd className="font-bold">{finding.component ? COMPONENT_LABELS[finding.component] : "Not yet known"}</dd>
        </div>
        <div className="rounded-md bg-surface p-3 edge">
          <dt className="text-sm text-muted">System</dt>
          <dd className="font-bold">
            {finding.systemId ? (
              <Link className="text-accent underline" to={`/systems/${finding.systemId}`}>
                {finding.systemName}
              </Link>
            ) : (
              "None"
            )}
          </dd>
        </div>
      </dl>
      {finding.note ? <p>{finding.note}</p> : null}
      {finding.systemRetiredOn && finding.status !== "closed" && finding.status !== "dismissed" ? (
        <Alert
          tone="note"
          title={`${finding.systemName} left service on ${formatCalendarDay(finding.systemRetiredOn)}`}
        >
          <p className="text-sm">
            No repair, verification test or leak check is owed on it any more, and no step of this finding may be dated
            after that day. An engineer or owner closes it with "Close: the system left service" (or closes a verified
            repair as verified).
          </p>
        </Alert>
      ) : null}
      {finding.fixtureLabel || finding.x !== null ? (
        <p className="text-sm text-muted">
          {finding.fixtureLabel ? `At ${finding.fixtureLabel}` : "On the plan"}
          {finding.x !== null && finding.y !== null
            ? `, ${len(finding.x)} across and ${len(finding.y)} down from the plan's top-left corner`
            : ""}
          .
        </p>
      ) : null}

      {finding.deadlines.length ? (
        <section aria-labelledby="deadlines" className="space-y-2">
          <h2 id="deadlines" className="text-lg font-bold">
            Deadlines
          </h2>
          {finding.deadlines.map((d) => (
            <Alert
              key={d.what}
              tone={d.state === "overdue" || d.state === "due-today" ? "error" : "note"}
              title={`${d.what}: ${formatCalendarDay(d.dueOn)}`}
            >
              <p className="text-sm">
                Rule: <SourceText source={d.source} />
              </p>
            </Alert>
          ))}
        </section>
      ) : null}

      <section aria-labelledby="history" className="space-y-2">
        <h2 id="history" className="text-lg font-bold">
          History
        </h2>
        <ol className="space-y-2 border-l-4 border-line pl-4">
          {finding.events.map((e) => (
            <li key={e.id}>
              <span className="font-bold">{formatCalendarDay(e.on)}</span> · {FINDING_EVENT_LABELS[e.kind]}
              {e.result ? ` — ${e.result}` : ""} · signed {e.by}
              {e.note ? <p className="text-muted">{e.note}</p> : null}
            </li>
          ))}
        </ol>
        <p className="text-sm text-muted">Dates are on the store's calendar ({finding.timeZone}).</p>
      </section>

      <section aria-labelledby="photos" className="space-y-2">
        <h2 id="photos" className="text-lg font-bold">
          Photos
        </h2>
        {message ? <Alert tone="error">{message}</Alert> : null}
        <div className="flex flex-wrap gap-3">
          {finding.photos.map((p) => (
            <a key={p.id} href={p.url} target="_blank" rel="noreferrer">
              <img src={p.thumbUrl} alt={`Photo by ${p.by}`} className="h-32 rounded-md edge" />
            </a>
          ))}
          {finding.photos.length === 0 ? <p className="text-muted">No photos.</p> : null}
        </div>
        {canAddPhoto ? (
          <label className="inline-flex min-h-11 cursor-pointer items-center rounded-md bg-surface px-4 font-bold edge">
            Add a photo (PNG or JPEG)
            <input
              type="file"
              accept="image/png,image/jpeg"
              capture="environment"
              className="sr-only"
              onChange={(e) => {
                const file = e.target.files?.[0];
                if (file) upload.mutate({ kind: "photo", findingId: finding.id, file });
                e.target.value = "";
              }}
            />
          </label>
        ) : null}
      </section>

      <Cautions items={finding.cautions} />
    </div>
  );
}
