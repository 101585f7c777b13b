import { useState, type FormEvent } from "react";
import { Button } from "../../../components/ui/button";
import { TextField } from "../../../components/ui/text-field";
import { serverFieldErrors, zodFieldErrors, type FieldErrors } from "../../../lib/form-errors";
import { withdrawReadingInput } from "#core/contracts/compliance";
import { useWithdrawReading } from "../api/withdraw-reading";

/**
 * The owner withdraws an accepted reading, saying why. The acceptance stays in the history; the
 * figures that use the reading show it as not accepted again (docs/decisions/0048-accepting-readings.md).
 */
export function WithdrawReading({ text }: { text: string }) {
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState("");
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const withdraw = useWithdrawReading();
  const errors = { ...serverFieldErrors(withdraw.error), ...clientErrors };

  function submit(e: FormEvent) {
    e.preventDefault();
    const parsed = withdrawReadingInput.safeParse({ text, reason });
    setClientErrors(parsed.success ? {} : zodFieldErrors(parsed.error));
    if (parsed.success) withdraw.mutate(parsed.data, { onSuccess: () => setOpen(false) });
  }

  if (!open)
    return (
      <Button variant="quiet" onClick={() => setOpen(true)} aria-label={`Withdraw acceptance: ${text}`}>
        Withdraw acceptance
      </Button>
    );
  return (
    <form onSubmit={submit} noValidate className="mt-2 space-y-2">
      <TextField
        label="Why the acceptance is withdrawn"
        name="reason"
        hint="Kept with the history and on the audit trail"
        value={reason}
        onChange={(e) => setReason(e.target.value)}
        error={errors.reason ?? errors.text}
      />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="danger" busy={withdraw.isPending}>
          Withdraw
        </Button>
        <Button variant="secondary" onClick={() => setOpen(false)}>
          Keep it accepted
        </Button>
      </div>
    </form>
  );
}
