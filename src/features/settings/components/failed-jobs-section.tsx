import type { FailedJob } from "#core/contracts/jobs";
import { Button } from "../../../components/ui/button";
import { DataTable } from "../../../components/ui/data-table";
import { EmptyState } from "../../../components/ui/empty-state";
import { QueryError } from "../../../components/ui/query-error";
import { Spinner } from "../../../components/ui/spinner";
import { formatDateTime } from "../../../lib/format";
import { useFailedJobs } from "../api/get-failed-jobs";

const KIND_LABELS: Record<FailedJob["kind"], string> = {
  invitation: "Invitation e-mail",
  report: "Report e-mail",
  digest: "Daily digest",
  analysis: "Field map",
};

function what(job: FailedJob): string {
  return job.to.length ? `${job.subject} → ${job.to.join(", ")}` : job.subject;
}

/** Work the server gave up on after its retries, with the reason: for the owner to act on. */
export function FailedJobsSection() {
  const q = useFailedJobs();
  return (
    <section aria-labelledby="failed-jobs-heading" className="mt-10 space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="failed-jobs-heading" className="text-xl font-bold">
          Failed jobs
        </h2>
        <Button variant="secondary" busy={q.isFetching} onClick={() => void q.refetch()}>
          Refresh
        </Button>
      </div>
      <p className="max-w-prose text-muted">
        E-mail, field maps and digests the server tried in the background and gave up on after its retries. Resend a
        report or an invitation from where it was sent; a field map is computed again when the sweep is opened.
      </p>
      {q.isPending ? <Spinner label="Loading failed jobs…" /> : null}
      {q.isError ? <QueryError error={q.error} what="the failed jobs" onRetry={() => void q.refetch()} /> : null}
      {q.data && q.data.jobs.length === 0 ? (
        <EmptyState title="No failed jobs">Nothing has given up.</EmptyState>
      ) : null}
      {q.data && q.data.jobs.length > 0 ? (
        <DataTable
          caption="Failed jobs, newest first"
          rows={q.data.jobs}
          rowKey={(j) => j.id}
          columns={[
            { header: "Kind", cell: (j) => KIND_LABELS[j.kind] },
            { header: "Queued", cell: (j) => formatDateTime(j.queuedAt) },
            { header: "What", cell: what },
            { header: "Attempts", cell: (j) => String(j.attempts), className: "text-right" },
            { header: "Reason", cell: (j) => j.reason ?? "No reason was recorded." },
          ]}
        />
      ) : null}
    </section>
  );
}
