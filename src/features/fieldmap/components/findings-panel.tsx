import { useState } from "react";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { TextField } from "../../../components/ui/text-field";
import type { FindingDetail as SweepFinding } from "#core/contracts/finding-actions";
import { FINDING_EVENT_LABELS } from "#core/contracts/findings";
import { useMarkRepaired } from "../api/findings";

function RepairForm({ finding, today }: { finding: SweepFinding; today: string }) {
  const [on, setOn] = useState(today);
  const [note, setNote] = useState("");
  const repair = useMarkRepaired();
  const noteError = repair.isError && note.trim() === "" ? "Say what was repaired" : undefined;
  return (
    <form
      className="mt-2 grid gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (note.trim() === "") return repair.reset();
        repair.mutate({ finding, on, note });
      }}
    >
      <TextField
        label="Repaired on"
        type="date"
        value={on}
        max={today}
        onChange={(e) => setOn(e.currentTarget.value)}
      />
      <TextField
        label="What was done"
        value={note}
        onChange={(e) => setNote(e.currentTarget.value)}
        error={noteError}
        placeholder="e.g. joint re-brazed, pressure tested"
      />
      <Button type="submit" className="justify-self-start" busy={repair.isPending} disabled={note.trim() === ""}>
        Mark repaired
      </Button>
      {repair.isError ? <Alert tone="error">{repair.error.message}</Alert> : null}
    </form>
  );
}

/** Findings made from this sweep, with the repair step for those still open. */
export function FindingsPanel({
  findings,
  canRecord,
  today,
  label,
}: {
  findings: SweepFinding[];
  canRecord: boolean;
  today: string;
  label(id: string | null): string | null;
}) {
  if (findings.length === 0) return <p className="text-sm text-muted">No findings from this sweep yet.</p>;
  return (
    <ul className="space-y-3">
      {findings.map((f) => (
        <li key={f.id} className="rounded-md edge bg-surface p-3" data-testid="sweep-finding">
          <p className="font-bold">
            {label(f.fixtureId) ?? "On the plan"} — <span className="capitalize">{f.status}</span>
          </p>
          {f.note ? <p className="text-sm">{f.note}</p> : null}
          <ul className="mt-1 text-sm text-muted">
            {f.events.map((e) => (
              <li key={e.id}>
                {formatCalendarDay(e.on)}: {FINDING_EVENT_LABELS[e.kind]}
                {e.result ? ` (${e.result})` : ""} by {e.by}
                {e.note ? ` — ${e.note}` : ""}
              </li>
            ))}
          </ul>
          {canRecord && (f.status === "suspected" || f.status === "confirmed") ? (
            <RepairForm finding={f} today={today} />
          ) : null}
        </li>
      ))}
    </ul>
  );
}
