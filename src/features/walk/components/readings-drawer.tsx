import { SAMPLE_POINT_LABELS } from "#core/contracts/sweeps";
import { Dialog } from "../../../components/ui/dialog";
import { COMPONENT_LABELS } from "#core/contracts/findings";
import type { LocalFinding, LocalReading } from "../model/local-types";
import { formatInZone } from "#core/domain/dates/format-in-zone";

function stateWord(r: LocalReading): string {
  switch (r.sync.kind) {
    case "draft":
      return "On the keypad — kept on this device";
    case "refused":
      return "Refused — fix it";
    case "synced":
      return "Uploaded";
    default:
      return "Waiting to upload";
  }
}

/** Every reading of the sweep, newest first, to edit or delete; refused ones show why. */
export function ReadingsDrawer(props: {
  open: boolean;
  readings: readonly LocalReading[];
  openId: string | null;
  /** Pinpointed leaks of this sweep still on the device. */
  findings: readonly LocalFinding[];
  timeZone: string;
  onEdit(r: LocalReading): void;
  onMove(r: LocalReading): void;
  onDelete(r: LocalReading): void;
  onDiscardFinding(clientId: string): void;
  onClose(): void;
}) {
  if (!props.open) return null; // thousands of rows: build them only when the list is shown
  const list = [...props.readings].map((r, i) => ({ r, n: i + 1 })).reverse();
  return (
    <Dialog title={`Readings (${props.readings.length})`} open={props.open} onClose={props.onClose} wide>
      {props.findings.length ? (
        <section aria-label="Leaks marked on this device" className="mb-3">
          <h3 className="font-bold">Leaks marked here, not yet on the server</h3>
          <ul className="flex flex-col gap-2">
            {props.findings.map((f) => (
              <li
                key={f.clientId}
                className={`rounded-md p-3 edge ${f.state === "rejected" ? "border-danger bg-danger-soft" : ""}`}
                data-testid="queued-finding"
              >
                <span className="font-bold">
                  {f.input.status === "confirmed" ? "Confirmed" : "Suspected"} leak
                  {f.input.component ? ` · ${COMPONENT_LABELS[f.input.component]}` : ""}
                  {f.photo ? " · with photo" : ""}
                </span>
                <span className="block text-muted">
                  {f.state === "rejected" ? "Refused by the server" : "Waiting to upload"}
                </span>
                {f.reasons ? (
                  <ul className="text-danger">
                    {Object.entries(f.reasons).map(([k, m]) => (
                      <li key={k}>{k ? `${k} ${m}` : m}</li>
                    ))}
                  </ul>
                ) : null}
                {f.state === "rejected" ? (
                  <button
                    type="button"
                    className="mt-2 min-h-12 rounded-md px-4 font-bold text-danger edge"
                    onClick={() => props.onDiscardFinding(f.clientId)}
                  >
                    Discard — mark it again
                  </button>
                ) : null}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      {list.length === 0 ? <p>No readings yet: tap the plan where the probe is.</p> : null}
      <ol className="flex flex-col gap-2">
        {list.map(({ r, n }) => (
          <li
            key={r.id}
            className={`rounded-md p-3 edge ${r.sync.kind === "refused" ? "border-danger bg-danger-soft" : ""}`}
            data-testid="reading-row"
          >
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <span className="font-bold">
                #{n} · {r.atLeast ? "≥ " : ""}
                {r.ppm} ppm · {SAMPLE_POINT_LABELS[r.samplePoint]}
              </span>
              <span className="text-muted">
                {formatInZone(r.takenAt, props.timeZone, "time")} · {stateWord(r)}
              </span>
            </div>
            {r.note ? <p>{r.note}</p> : null}
            {r.sync.kind === "refused" ? (
              <ul className="text-danger">
                {Object.entries(r.sync.reasons).map(([k, m]) => (
                  <li key={k}>{k ? `${k} ${m}` : m}</li>
                ))}
              </ul>
            ) : null}
            <div className="mt-2 flex gap-2">
              <button type="button" className="min-h-12 rounded-md px-4 font-bold edge" onClick={() => props.onEdit(r)}>
                {r.id === props.openId ? "Back to keypad" : "Edit"}
              </button>
              <button type="button" className="min-h-12 rounded-md px-4 font-bold edge" onClick={() => props.onMove(r)}>
                Move
              </button>
              <button
                type="button"
                className="min-h-12 rounded-md px-4 font-bold text-danger edge"
                onClick={() => props.onDelete(r)}
              >
                Delete
              </button>
            </div>
          </li>
        ))}
      </ol>
    </Dialog>
  );
}
