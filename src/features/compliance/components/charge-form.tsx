import { useState, type FormEvent } from "react";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Select } from "../../../components/ui/select";
import { TextField } from "../../../components/ui/text-field";
import { formErrorMessage, serverFieldErrors } from "../../../lib/form-errors";
import { useRecordCharge } from "../api/record-charge";
import type { NumberFormat } from "#core/domain/numbers/number-format";
import { amountHint, readAmount } from "../model/amount-entry";
import type { MassUnit } from "../model/figures";
import { EXCLUSION_NAMES, EXCLUSIONS } from "#core/contracts/compliance";

/**
 * Record refrigerant put into a system; or, with `corrects`, a correction that voids that entry.
 * The amount is read in the company's number format and echoed under the field before it is sent.
 */
export function ChargeForm({
  systemId,
  today,
  unit,
  numberFormat,
  findings,
  corrects,
  onDone,
}: {
  systemId: string;
  today: string;
  unit: MassUnit;
  numberFormat: NumberFormat;
  findings: { id: string; label: string }[];
  corrects?: { id: string; addedOn: string; excluded?: (typeof EXCLUSIONS)[number] | null };
  onDone?: () => void;
}) {
  const [addedOn, setAddedOn] = useState(corrects?.addedOn ?? today);
  const [amount, setAmount] = useState("");
  const [amountUnit, setAmountUnit] = useState<MassUnit>(unit);
  const [reason, setReason] = useState("");
  const [findingId, setFindingId] = useState("");
  const [excluded, setExcluded] = useState<(typeof EXCLUSIONS)[number] | "">(corrects?.excluded ?? "");
  const [voidReason, setVoidReason] = useState("");
  const [amountProblem, setAmountProblem] = useState<string | null>(null);
  const read = readAmount(amount, amountUnit, numberFormat);
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
    // Nothing is sent that the form could not read: the field says why, and what was typed stays.
    setAmountProblem(read.problem);
    if (read.problem) return;
    const input = {
      addedOn,
      amount: { value: read.value, unit: amountUnit },
      reason,
      findingId: findingId || null,
      excluded: excluded || null,
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
          onChange={(e) => {
            setAmount(e.target.value);
            setAmountProblem(null);
          }}
          hint={amountHint(amount, read, numberFormat)}
          error={amountProblem ?? fields["amount.value"]}
          required
        />
        <Select
          label="Unit"
          value={amountUnit}
          onChange={(e) => setAmountUnit(e.target.value as MassUnit)}
          // The reader's own unit first: an lb company sees lb first everywhere.
          options={(unit === "lb" ? (["lb", "kg"] as const) : (["kg", "lb"] as const)).map((u) => ({
            value: u,
            label: u,
          }))}
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
      <Select
        label="Leak-rate calculation"
        value={excluded}
        onChange={(e) => setExcluded(e.target.value as typeof excluded)}
        // 40 CFR 82.157 / 84.106: no leak rate after a retrofit, a new installation or a seasonal
        // variance (docs/reference/standards.md §1 [S:R1]); such a fill is recorded but counts no loss.
        hint="Refrigerant put in for one of these is recorded but is not a leak"
        options={[
          { value: "", label: "Counted: refrigerant lost to a leak" },
          ...EXCLUSIONS.map((x) => ({ value: x, label: `Not counted: ${EXCLUSION_NAMES[x]}` })),
        ]}
        error={fields.excluded}
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
