import { useState, type FormEvent } from "react";
import type { SystemRecordsView } from "#core/contracts/compliance";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { Button } from "../../../components/ui/button";
import { Checkbox } from "../../../components/ui/checkbox";
import { TextField } from "../../../components/ui/text-field";
import { formErrorMessage, serverFieldErrors } from "../../../lib/form-errors";
import { useRecordCharge } from "../api/record-charge";

/** Record a check of the leak detection system itself: its own yearly clock runs from a check that found it working. */
function LeakDetectionCheckForm({ systemId, today }: { systemId: string; today: string }) {
  const [checkedOn, setCheckedOn] = useState(today);
  const [fault, setFault] = useState(false);
  const [note, setNote] = useState("");
  const mutation = useRecordCharge({ onDone: () => setNote("") });
  const fields = serverFieldErrors(mutation.error);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    mutation.mutate({ kind: "leak-detection-check", systemId, input: { checkedOn, working: !fault, note } });
  };
  const message = formErrorMessage(mutation.error);
  return (
    <form
      onSubmit={submit}
      className="grid gap-3 sm:grid-cols-2"
      aria-label="Record a check of the leak detection system"
    >
      {message ? <p className="text-danger sm:col-span-2">{message}</p> : null}
      <TextField
        label="Detection system checked on"
        type="date"
        max={today}
        value={checkedOn}
        onChange={(e) => setCheckedOn(e.target.value)}
        error={fields.checkedOn}
      />
      <TextField
        label="What was checked"
        hint="e.g. sensors tested with gas, alarm and its relay"
        value={note}
        onChange={(e) => setNote(e.target.value)}
        error={fields.note}
      />
      <Checkbox
        label="A fault was found (it did not work as it should)"
        checked={fault}
        onChange={(e) => setFault(e.target.checked)}
      />
      <div>
        <Button type="submit" variant="secondary" busy={mutation.isPending}>
          Record the detection system check
        </Button>
      </div>
    </form>
  );
}

/**
 * The checks of a system's leak detection system (EU: at least every 12 months where one is
 * mandatory, decision 0123). Shown where the check is owed or one was recorded.
 */
export function LeakDetectionChecks({ r, canRecord }: { r: SystemRecordsView; canRecord: boolean }) {
  if (!r.leakDetectionCheckOwed && r.leakDetectionChecks.length === 0) return null;
  return (
    <section aria-labelledby="lds-checks" className="space-y-3">
      <h2 id="lds-checks" className="text-xl font-bold">
        Checks of the leak detection system
      </h2>
      <p className="text-sm text-muted">
        Where a leak detection system is mandatory, it is itself checked at least once every 12 months (Regulation (EU)
        2024/573, Art. 5).
      </p>
      {canRecord ? <LeakDetectionCheckForm systemId={r.system.id} today={r.today} /> : null}
      {r.leakDetectionChecks.length === 0 ? (
        <p className="text-muted">No check of the leak detection system recorded.</p>
      ) : (
        <ul className="space-y-1">
          {r.leakDetectionChecks.map((c) => (
            <li key={c.id}>
              {formatCalendarDay(c.checkedOn)}: {c.working ? "working" : "fault found"} — {c.by}
              {c.note ? ` (${c.note})` : ""}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
