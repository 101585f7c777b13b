import { Link } from "react-router";
import { QueryError } from "../../../components/ui/query-error";
import { countOf, formatDateTime } from "../../../lib/format";
import { useResumableSweeps } from "../api/resumable-sweeps";

/**
 * Sweeps left half-way, where a technician looks for them (the Walk page, a store's page): each
 * with how many readings it holds and how many wait to upload; one tap resumes it. Nothing is
 * shown when there is none.
 */
export function ResumeSweeps({
  userId,
  storeId = null,
  storeNames,
}: {
  userId: string;
  /** One store's sweeps only; all the member's stores when null. */
  storeId?: string | null;
  /** Store names the page already has (the device's copy names the rest). */
  storeNames?: ReadonlyMap<string, string>;
}) {
  const list = useResumableSweeps(userId, storeId);
  if (list.isError)
    return <QueryError error={list.error} what="the sweeps in progress" onRetry={() => void list.refetch()} />;
  if (!list.data?.length) return null;
  return (
    <section aria-labelledby="resume-sweeps" className="mb-6" data-testid="resume-sweeps">
      <h2 id="resume-sweeps" className="mb-2 text-lg font-bold">
        Sweeps in progress
      </h2>
      <ul className="grid gap-3 sm:grid-cols-2">
        {list.data.map((s) => {
          const store = storeNames?.get(s.storeId) ?? s.storeName;
          return (
            <li key={s.sweepId}>
              <Link
                to={`/stores/${s.storeId}/walk/${s.sweepId}`}
                className="flex min-h-14 items-center justify-between gap-3 rounded-md border-l-4 border-accent bg-surface p-3 no-underline edge"
                data-testid="resume-sweep"
                data-sweep-id={s.sweepId}
              >
                <span className="min-w-0">
                  <span className="block truncate font-bold">
                    {storeId ? `Started ${formatDateTime(s.startedAt)}` : (store ?? "A store")}
                  </span>
                  <span className="block text-sm text-muted">
                    {storeId ? "" : `${formatDateTime(s.startedAt)} · `}
                    {s.own ? "yours" : (s.technicianName ?? "another technician")}
                    {s.onlyOnDevice ? " · only on this device" : ""}
                  </span>
                  <span className="block text-sm" data-testid="resume-counts">
                    {countOf(s.readings, "reading")} ·{" "}
                    {s.waiting
                      ? `${s.waiting} waiting to upload`
                      : s.onlyOnDevice
                        ? "not uploaded yet"
                        : "all uploaded"}
                  </span>
                </span>
                <span className="inline-flex min-h-12 shrink-0 items-center rounded-md bg-accent px-4 font-bold text-on-accent">
                  Resume
                </span>
              </Link>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
