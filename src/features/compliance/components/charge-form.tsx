import { useState, type FormEvent } from "react";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Select } from "../../../components/ui/select";
import { TextField } from "../../../components/ui/text-field";
import { formErrorMessage, serverFieldErrors } from "../../../lib/form-errors";
import { useRecordCharge } from "../api/record-charge";
import type { MassUnit } from "../model/figures";

/** Record refrigerant put into a system; or, with `corrects`, a correction that voids that entry. */
export function ChargeForm({
  systemId,
  today,
  unit,
  findings,
  corrects,
  onDone,
}: {
  systemId: string;
  today: string;
  unit: MassUnit;
  findings: { id: string; label: string }[];
  corrects?: { id: string; addedOn: string };
  onDone?: () => void;
}) {
  const [addedOn, setAddedOn] = useState(corrects?.addedOn ?? today);
  const [amount, setAmount] = useState("");
  const [amountUnit, setAmountUnit] = useState<MassUnit>(unit);
  const [reason, setReason] = useState("");
  const [findingId, setFindingId] = useState("");
  const [voidReason, setVoidReason] = useState("");
  const mutation = useRecordCharge({
    onDone: () => {
      setAmount("");
      setReason("");
      setVoidReason("");
      onDone?.();
    },
  });
  const fields = serverFieldErrors(mutation.error);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const input = {
      addedOn,
      amount: { value: Number(amount), unit: amountUnit },
      reason,
      findingId: findingId || null,
    };
    if (corrects) mutation.mutate({ kind: "correct", additionId: corrects.id, input: { ...input, voidReason } });
    else mutation.mutate({ kind: "add", systemId, input });
  };
  const message = formErrorMessage(mutation.error);
  return (
    <form
      onSubmit={submit}
      className="grid gap-3 sm:grid-cols-2"
      aria-label={corrects ? "Correct the entry" : "Record charge added"}
    >
      {message ? (
        <div className="sm:col-span-2">
          <Alert tone="error">{message}</Alert>
        </div>
      ) : null}
      <TextField
        label="Date added"
        type="date"
        max={today}
        value={addedOn}
        onChange={(e) => setAddedOn(e.target.value)}
        error={fields.addedOn}
        hint="On the store's calendar"
      />
      <div className="flex gap-2">
        <TextField
          className="flex-1"
          label="Amount added"
          inputMode="decimal"
          value={amount}
          onChange={(e) => setAmount(e.target.value)}
          error={fields["amount.value"]}
          required
        />
        <Select
          label="Unit"
          value={amountUnit}
          onChange={(e) => setAmountUnit(e.target.value as MassUnit)}
          options={[
            { value: "kg", label: "kg" },
            { value: "lb", label: "lb" },
          ]}
          error={fields["amount.unit"]}
        />
      </div>
      <TextField
        label="Reason"
        value={reason}
        onChange={(e) => setReason(e.target.value)}
        error={fields.reason}
        hint="Why refrigerant was added"
        required
      />
      <Select
        label="Linked finding"
        value={findingId}
        onChange={(e) => setFindingId(e.target.value)}
        options={[{ value: "", label: "None" }, ...findings.map((f) => ({ value: f.id, label: f.label }))]}
        error={fields.findingId}
      />
      {corrects ? (
        <TextField
          className="sm:col-span-2"
          label="Why the old entry is wrong"
          value={voidReason}
          onChange={(e) => setVoidReason(e.target.value)}
          error={fields.voidReason}
          required
        />
      ) : null}
      <div className="sm:col-span-2">
        <Button type="submit" busy={mutation.isPending}>
          {corrects ? "Save the correction" : "Record charge added"}
        </Button>
      </div>
    </form>
  );
}
