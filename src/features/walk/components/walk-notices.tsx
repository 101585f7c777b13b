import { Alert } from "../../../components/ui/alert";
import type { LocalSweep } from "../model/local-types";
import { StripChip, useFoldedStrip } from "./notice-strip";

/** The server refused the sweep itself: its reasons; the readings stay on the device. */
export function RefusedSweepNotice({ sync }: { sync: LocalSweep["sync"] }) {
  const folded = useFoldedStrip();
  if (sync.kind !== "refused") return null;
  const reasons = Object.entries(sync.reasons)
    .map(([k, m]) => (k ? `${k} ${m}` : m))
    .join("; ");
  if (folded)
    return (
      <StripChip tone="danger" role="alert">
        The server refused this sweep: {reasons}
      </StripChip>
    );
  return (
    <Alert tone="error" title="The server refused this sweep">
      {reasons} Its readings stay on this device.
    </Alert>
  );
}

/** A short word after something the technician did (submitted, a finding saved, readings imported). */
export function DoneNotice({ text, onDismiss }: { text: string | null; onDismiss(): void }) {
  const folded = useFoldedStrip();
  if (!text) return null;
  if (folded)
    return (
      <StripChip tone="ok" role="status">
        {text}
      </StripChip>
    );
  return (
    <Alert tone="success">
      <span>{text} </span>
      <button type="button" className="min-h-12 underline" onClick={onDismiss}>
        Dismiss
      </button>
    </Alert>
  );
}
