import { useState, type FormEvent } from "react";
import { Button } from "../../../components/ui/button";
import { Checkbox } from "../../../components/ui/checkbox";
import { TextField } from "../../../components/ui/text-field";
import { formErrorMessage, serverFieldErrors } from "../../../lib/form-errors";
import { useRecordCharge } from "../api/record-charge";

/** Record a leak check or periodic inspection: the next inspection date runs from it. */
export function LeakCheckForm({ systemId, today }: { systemId: string; today: string }) {
  const [checkedOn, setCheckedOn] = useState(today);
  const [leakFound, setLeakFound] = useState(false);
  const [note, setNote] = useState("");
  const mutation = useRecordCharge({ onDone: () => setNote("") });
  const fields = serverFieldErrors(mutation.error);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    mutation.mutate({ kind: "leak-check", systemId, input: { checkedOn, leakFound, note } });
  };
  const message = formErrorMessage(mutation.error);
  return (
    <form onSubmit={submit} className="grid gap-3 sm:grid-cols-2" aria-label="Record a leak check">
      {message ? <p className="text-danger sm:col-span-2">{message}</p> : null}
      <TextField
        label="Checked on"
        type="date"
        max={today}
        value={checkedOn}
        onChange={(e) => setCheckedOn(e.target.value)}
        error={fields.checkedOn}
      />
      <TextField label="Note" value={note} onChange={(e) => setNote(e.target.value)} error={fields.note} />
      <Checkbox
        label="A leak was found (record it as a finding too)"
        checked={leakFound}
        onChange={(e) => setLeakFound(e.target.checked)}
      />
      <div>
        <Button type="submit" variant="secondary" busy={mutation.isPending}>
          Record the leak check
        </Button>
      </div>
    </form>
  );
}
