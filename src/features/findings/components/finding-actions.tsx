import { useState, type FormEvent } from "react";
import type { FindingDetail } from "#core/contracts/finding-actions";
import { COMPONENT_LABELS, DISMISS_REASONS, FINDING_COMPONENTS } from "#core/contracts/findings";
import { ACTION_LABELS, ACTION_PERMISSION, type FindingAction } from "#core/domain/findings/lifecycle";
import { can, type Role } from "#core/domain/roles";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Select } from "../../../components/ui/select";
import { TextField } from "../../../components/ui/text-field";
import { formErrorMessage, serverFieldErrors } from "../../../lib/form-errors";
import { useChangeFinding } from "../api/change-finding";

const REASON_LABELS: Record<(typeof DISMISS_REASONS)[number], string> = {
  "benign-source": "Benign source (not a leak)",
  "no-leak-found": "No leak found",
  other: "Other (say why in the note)",
};

/** The next lifecycle step: one form, its fields following the chosen action. */
export function FindingActions({ finding, role, today }: { finding: FindingDetail; role: Role; today: string }) {
  const allowed = finding.nextActions.filter((a) => can(role, ACTION_PERMISSION[a]));
  const [action, setAction] = useState<FindingAction | null>(allowed[0] ?? null);
  // Once the system has left service, a step other than its closing is dated by that day.
  const retiredBy = (a: FindingAction | null) =>
    finding.systemRetiredOn && a !== "close-left-service" && finding.systemRetiredOn < today
      ? finding.systemRetiredOn
      : today;
  const [on, setOn] = useState(() => retiredBy(allowed[0] ?? null));
  const [note, setNote] = useState("");
  const [component, setComponent] = useState(finding.component ?? "");
  const [result, setResult] = useState<"passed" | "failed">("passed");
  const [reason, setReason] = useState<(typeof DISMISS_REASONS)[number]>("benign-source");
  const m = useChangeFinding({ onDone: () => setNote("") });
  const current = action && allowed.includes(action) ? action : (allowed[0] ?? null);
  if (!current) return null;
  const fields = serverFieldErrors(m.error);
  // Once the system has left service, its closing is dated on or after that day (the day it is done by
  // default) and every other step by then.
  const retiredOn = finding.systemRetiredOn;
  const pick = (a: FindingAction) => {
    setAction(a);
    if (retiredOn && (a === "close-left-service" || on > retiredOn)) setOn(retiredBy(a));
  };
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const base = { on, note };
    const input =
      current === "confirm"
        ? {
            action: current,
            ...base,
            ...(component ? { component: component as (typeof FINDING_COMPONENTS)[number] } : {}),
          }
        : current === "initial-test" || current === "follow-up-test"
          ? { action: current, ...base, result }
          : current === "dismiss"
            ? { action: current, ...base, reason }
            : { action: current, ...base };
    m.mutate({ kind: "event", findingId: finding.id, input });
  };
  const message = formErrorMessage(m.error);
  return (
    <form onSubmit={submit} noValidate aria-label="Next step" className="space-y-3 rounded-md bg-surface p-4 edge">
      <h2 className="text-lg font-bold">Next step</h2>
      {message ? <Alert tone="error">{message}</Alert> : null}
      <div className="flex flex-wrap gap-2" role="group" aria-label="Step">
        {allowed.map((a) => (
          <Button
            key={a}
            variant={a === current ? "primary" : "secondary"}
            aria-pressed={a === current}
            onClick={() => pick(a)}
          >
            {ACTION_LABELS[a]}
          </Button>
        ))}
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField
          label="Date"
          name="on"
          type="date"
          max={retiredOn && current !== "close-left-service" && retiredOn < today ? retiredOn : today}
          min={retiredOn && current === "close-left-service" ? retiredOn : undefined}
          value={on}
          onChange={(e) => setOn(e.target.value)}
          error={fields.on}
          hint="On the store's calendar"
        />
        {current === "confirm" ? (
          <Select
            label="Component"
            value={component}
            onChange={(e) => setComponent(e.target.value)}
            error={fields.component}
            options={[
              { value: "", label: "Choose…" },
              ...FINDING_COMPONENTS.map((c) => ({ value: c, label: COMPONENT_LABELS[c] })),
            ]}
          />
        ) : null}
        {current === "initial-test" || current === "follow-up-test" ? (
          <Select
            label="Result"
            value={result}
            onChange={(e) => setResult(e.target.value as "passed" | "failed")}
            error={fields.result}
            options={[
              { value: "passed", label: "Passed: no leak" },
              { value: "failed", label: "Failed: still leaking" },
            ]}
          />
        ) : null}
        {current === "dismiss" ? (
          <Select
            label="Reason"
            value={reason}
            onChange={(e) => setReason(e.target.value as typeof reason)}
            error={fields.reason}
            options={DISMISS_REASONS.map((r) => ({ value: r, label: REASON_LABELS[r] }))}
          />
        ) : null}
        <TextField
          className="sm:col-span-2"
          label="Note"
          value={note}
          onChange={(e) => setNote(e.target.value)}
          error={fields.note}
        />
      </div>
      <Button type="submit" variant={current === "dismiss" ? "danger" : "primary"} busy={m.isPending}>
        Save: {ACTION_LABELS[current].toLowerCase()}
      </Button>
    </form>
  );
}
