import { useState, type FormEvent } from "react";
import { COMPONENT_LABELS, FINDING_COMPONENTS } from "#core/contracts/findings";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Select } from "../../../components/ui/select";
import { TextField } from "../../../components/ui/text-field";
import { formErrorMessage, serverFieldErrors } from "../../../lib/form-errors";
import { useChangeFinding } from "../api/change-finding";
import { foundAtFor } from "../model/found-at";

/**
 * Record a finding by hand on a system (the Walk screen and the field map make theirs from a spot).
 * A leak found on an earlier day (typed up from a service ticket) keeps that day, so its later
 * steps and the charge added for it can be dated as they happened.
 */
export function NewFindingForm({
  storeId,
  systemId,
  today,
  timeZone,
  onCreated,
}: {
  storeId: string;
  systemId: string;
  /** Today on the store's calendar, and the store's zone: the found day is read on that calendar. */
  today: string;
  timeZone: string;
  onCreated: (id: string) => void;
}) {
  const [foundOn, setFoundOn] = useState(today);
  const [component, setComponent] = useState("");
  const [note, setNote] = useState("");
  const m = useChangeFinding({ onDone: onCreated });
  const fields = serverFieldErrors(m.error);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    m.mutate({
      kind: "create",
      storeId,
      input: {
        systemId,
        source: "manual",
        note,
        component: (component || null) as (typeof FINDING_COMPONENTS)[number] | null,
        clientId: crypto.randomUUID(),
        foundAt: foundAtFor(foundOn, today, timeZone),
      },
    });
  };
  const message = formErrorMessage(m.error);
  return (
    <form onSubmit={submit} aria-label="Record a finding" className="grid gap-3 sm:grid-cols-2">
      {message ? (
        <div className="sm:col-span-2">
          <Alert tone="error">{message}</Alert>
        </div>
      ) : null}
      <TextField
        label="Found on"
        type="date"
        max={today}
        value={foundOn}
        onChange={(e) => setFoundOn(e.target.value)}
        error={fields.foundAt}
        hint="On the store's calendar"
      />
      <Select
        label="Component (if known)"
        value={component}
        onChange={(e) => setComponent(e.target.value)}
        error={fields.component}
        options={[
          { value: "", label: "Not yet known" },
          ...FINDING_COMPONENTS.map((c) => ({ value: c, label: COMPONENT_LABELS[c] })),
        ]}
      />
      <TextField
        label="What was found"
        value={note}
        onChange={(e) => setNote(e.target.value)}
        error={fields.note}
        hint="Where, what the detector showed"
      />
      <div className="sm:col-span-2">
        <Button type="submit" variant="secondary" busy={m.isPending}>
          Record a suspected leak
        </Button>
      </div>
    </form>
  );
}
