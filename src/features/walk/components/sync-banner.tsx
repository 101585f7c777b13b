import type { SyncStatus } from "../hooks/sync-loop";
import { StripChip, useFoldedStrip } from "./notice-strip";

/** How many readings wait on this device, and whether the connection is there. */
export function SyncBanner({ status, onShowRejected }: { status: SyncStatus; onShowRejected(): void }) {
  const folded = useFoldedStrip();
  const { waiting, rejected, online, syncing } = status;
  const tone = rejected ? "danger" : waiting ? "note" : "ok";
  const text = waiting
    ? `${waiting} ${waiting === 1 ? "change" : "changes"} waiting to upload${online ? (syncing ? " — uploading…" : "") : " — offline, kept on this device"}`
    : online
      ? "All readings uploaded"
      : "Offline — readings are kept on this device";
  const data = {
    "data-testid": "sync-banner",
    "data-waiting": waiting,
    "data-stopped-by": status.lastReport?.stoppedBy ?? "",
  };
  if (folded)
    return (
      <StripChip tone={tone} role="status" {...data}>
        {rejected ? `${rejected} need fixing · ` : ""}
        {text}
      </StripChip>
    );
  const look = {
    danger: "bg-danger-soft text-danger border-danger",
    note: "bg-note-soft text-note border-note",
    ok: "bg-ok-soft text-ok border-ok",
  }[tone];
  return (
    <div
      role="status"
      {...data}
      className={`flex min-h-12 items-center justify-between gap-2 rounded-md border-l-4 px-3 edge ${look}`}
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
