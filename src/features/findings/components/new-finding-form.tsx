import { useState, type FormEvent } from "react";
import { COMPONENT_LABELS, FINDING_COMPONENTS } from "#core/contracts/findings";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Select } from "../../../components/ui/select";
import { TextField } from "../../../components/ui/text-field";
import { formErrorMessage, serverFieldErrors } from "../../../lib/form-errors";
import { useChangeFinding } from "../api/change-finding";

/** Record a finding by hand on a system (the Walk screen and the field map make theirs from a spot). */
export function NewFindingForm({
  storeId,
  systemId,
  onCreated,
}: {
  storeId: string;
  systemId: string;
  onCreated: (id: string) => void;
}) {
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
