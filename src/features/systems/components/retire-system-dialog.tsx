import { useState, type FormEvent } from "react";
import { RETIRE_REASON_NAMES, RETIRE_REASONS, type System } from "#core/contracts/systems";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Dialog } from "../../../components/ui/dialog";
import { Select } from "../../../components/ui/select";
import { TextField } from "../../../components/ui/text-field";
import { formErrorMessage, serverFieldErrors, type FieldErrors } from "../../../lib/form-errors";
import { useRetireSystem } from "../api/retire-system";
import { readRetireDraft, type RetireDraft } from "../model/retire-draft";
import { useFindings } from "../../../entities/findings/findings-api";
import { COMPONENT_LABELS } from "#core/contracts/findings";
import { ACTION_LABELS } from "#core/domain/findings/lifecycle";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";

const localToday = () => new Date().toLocaleDateString("sv-SE");

/**
 * "Retire system…": asks the day the system left service and why. Its records stay for the rule
 * profile's retention period from that day (docs/decisions/0040, 0124).
 */
export function RetireSystemDialog({ system, onClose }: { system: System | null; onClose(): void }) {
  return (
    <Dialog title={system ? `Retire ${system.name}` : "Retire system"} open={system !== null} onClose={onClose}>
      {system ? <RetireForm key={system.id} system={system} onClose={onClose} /> : null}
    </Dialog>
  );
}

function RetireForm({ system, onClose }: { system: System; onClose(): void }) {
  const today = localToday();
  const [draft, setDraft] = useState<RetireDraft>({ retiredOn: today, reasonKind: "", reason: "" });
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const retire = useRetireSystem();
  const errors = { ...serverFieldErrors(retire.error), ...clientErrors };
  const set = <K extends keyof RetireDraft>(k: K, v: RetireDraft[K]) => setDraft((d) => ({ ...d, [k]: v }));

  function submit(e: FormEvent) {
    e.preventDefault();
    const read = readRetireDraft(draft, { today, inServiceOn: system.inServiceOn });
    setClientErrors(read.errors ?? {});
    if (read.input) retire.mutate({ id: system.id, input: read.input }, { onSuccess: onClose });
  }

  const message = formErrorMessage(retire.error);
  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label={`Retire ${system.name}`}>
      <p className="text-sm">
        {system.hasRecords
          ? `${system.name} has records, so it is retired, never deleted.`
          : `${system.name} has no records yet; retiring keeps it listed under the store's retired systems.`}{" "}
        Its records stay readable and are kept for the rule profile's period from the day it left service. It takes no
        new entry once retired.
      </p>
      <OpenFindings system={system} />
      {message ? <Alert tone="error">{message}</Alert> : null}
      <TextField
        label="Retired on"
        hint="The day it left service, on the store's calendar"
        type="date"
        max={today}
        min={system.inServiceOn}
        value={draft.retiredOn}
        onChange={(e) => set("retiredOn", e.target.value)}
        error={errors.retiredOn}
        className="w-56"
      />
      <Select
        label="Reason"
        value={draft.reasonKind}
        onChange={(e) => set("reasonKind", e.target.value as RetireDraft["reasonKind"])}
        options={[
          { value: "", label: "Choose…" },
          ...RETIRE_REASONS.map((k) => ({ value: k, label: RETIRE_REASON_NAMES[k] })),
        ]}
        error={errors.reasonKind}
      />
      <TextField
        label={draft.reasonKind === "other" ? "Why it left service" : "Note (optional)"}
        hint={draft.reasonKind === "replaced" ? "e.g. which system replaced it" : undefined}
        value={draft.reason}
        onChange={(e) => set("reason", e.target.value)}
        error={errors.reason}
      />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="danger" busy={retire.isPending}>
          Retire {system.name}
        </Button>
        <Button variant="secondary" onClick={onClose}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/**
 * The findings still open on the system: once it is retired each is closed as "left service" by an
 * engineer or owner, as its own signed step, rather than here (docs/decisions/0166: retiring is a lead
 * tech's step, closing a finding is not).
 */
function OpenFindings({ system }: { system: System }) {
  const findings = useFindings(system.storeId, system.id);
  const open = (findings.data ?? []).filter((f) => f.status !== "closed" && f.status !== "dismissed");
  if (open.length === 0) return null;
  return (
    <Alert tone="note" title={`${open.length === 1 ? "One finding is" : `${open.length} findings are`} still open`}>
      <ul className="list-disc pl-5 text-sm" aria-label="Open findings">
        {open.map((f) => (
          <li key={f.id}>
            {formatCalendarDay(f.events[0]?.on ?? null)} · {f.component ? COMPONENT_LABELS[f.component] : "leak"} ·{" "}
            {f.status}
          </li>
        ))}
      </ul>
      <p className="text-sm">
        Once {system.name} is retired they owe no repair, test or leak check; an engineer or owner then closes each with
        "{ACTION_LABELS["close-left-service"]}". A step taken before it left service is recorded first, dated by then.
      </p>
    </Alert>
  );
}
