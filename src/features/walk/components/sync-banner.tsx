import type { SyncStatus } from "../hooks/sync-loop";

/** How many readings wait on this device, and whether the connection is there. */
export function SyncBanner({ status, onShowRejected }: { status: SyncStatus; onShowRejected(): void }) {
  const { waiting, rejected, online, syncing } = status;
  const tone = rejected
    ? "bg-danger-soft text-danger border-danger"
    : waiting
      ? "bg-note-soft text-note border-note"
      : "bg-ok-soft text-ok border-ok";
  const text = waiting
    ? `${waiting} ${waiting === 1 ? "change" : "changes"} waiting to upload${online ? (syncing ? " — uploading…" : "") : " — offline, kept on this device"}`
    : online
      ? "All readings uploaded"
      : "Offline — readings are kept on this device";
  return (
    <div
      role="status"
      data-testid="sync-banner"
      data-waiting={waiting}
      data-stopped-by={status.lastReport?.stoppedBy ?? ""}
      className={`flex min-h-12 items-center justify-between gap-2 rounded-md border-l-4 px-3 edge ${tone}`}
    >
      <span className="font-bold">{text}</span>
      {rejected ? (
        <button type="button" className="min-h-12 font-bold underline" onClick={onShowRejected}>
          {rejected} need fixing
        </button>
      ) : null}
    </div>
  );
}
