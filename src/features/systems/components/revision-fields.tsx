import { REVISION_KINDS } from "#core/contracts/systems";
import { Select } from "../../../components/ui/select";
import { TextField } from "../../../components/ui/text-field";
import type { FieldErrors } from "../../../lib/form-errors";

export type RevisionKind = (typeof REVISION_KINDS)[number];

const KIND_LABELS: Record<RevisionKind, string> = {
  change: "The system changed on that day",
  correction: "The earlier value was entered wrongly",
  retrofit: "Retrofit to a new refrigerant",
};

export interface RevisionDraft {
  effectiveFrom: string;
  kind: RevisionKind;
  reason: string;
}

/**
 * Asked whenever an edit changes a dated fact (charge, refrigerant, type, detection, in-service
 * day): from which day it holds, what kind of change it is and why. Past figures keep the values
 * of their own dates (docs/decisions/0043-system-revisions.md).
 */
export function RevisionFields({
  value,
  onChange,
  changed,
  errors,
}: {
  value: RevisionDraft;
  onChange: (next: RevisionDraft) => void;
  changed: string[];
  errors: FieldErrors;
}) {
  return (
    <fieldset className="space-y-3 rounded-md bg-paper p-3 edge">
      <legend className="px-1 font-bold">A dated revision</legend>
      <p className="text-sm text-muted">
        You changed {changed.join(", ")}. These facts are kept with their dates: figures before the day below keep the
        earlier values.
      </p>
      <TextField
        label="Takes effect on"
        name="effectiveFrom"
        type="date"
        value={value.effectiveFrom}
        onChange={(e) => onChange({ ...value, effectiveFrom: e.target.value })}
        error={errors.effectiveFrom}
        className="w-56"
      />
      <Select
        label="Kind of change"
        name="kind"
        value={value.kind}
        onChange={(e) => onChange({ ...value, kind: e.target.value as RevisionKind })}
        options={REVISION_KINDS.map((k) => ({ value: k, label: KIND_LABELS[k] }))}
        error={errors.kind}
      />
      <TextField
        label="Reason"
        name="reason"
        hint="For the record, e.g. Receiver replaced, charge re-weighed"
        value={value.reason}
        onChange={(e) => onChange({ ...value, reason: e.target.value })}
        error={errors.reason}
      />
    </fieldset>
  );
}
