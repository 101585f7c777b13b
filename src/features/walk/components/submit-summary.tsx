import type { Fixture } from "#core/contracts/fixtures";
import { FIXTURE_KIND_NAMES } from "#core/contracts/fixture-kinds";
import type { LocalReading } from "../model/local-types";
import { Button } from "../../../components/ui/button";
import { Dialog } from "../../../components/ui/dialog";

export function SubmitSummary(props: {
  open: boolean;
  readings: readonly LocalReading[];
  alarmPpm: number;
  unsampled: readonly Fixture[];
  waiting: number;
  onSubmit(): void;
  onClose(): void;
}) {
  const alarms = props.readings.filter((r) => r.ppm >= props.alarmPpm);
  const rejected = props.readings.filter((r) => r.sync.kind === "refused");
  return (
    <Dialog title="Submit this sweep?" open={props.open} onClose={props.onClose}>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-lg">
        <dt className="font-bold">Readings</dt>
        <dd data-testid="summary-readings">{props.readings.length}</dd>
        <dt className="font-bold">At or above the alarm ({props.alarmPpm} ppm)</dt>
        <dd data-testid="summary-alarms">{alarms.length}</dd>
        <dt className="font-bold">Fixtures not sampled</dt>
        <dd data-testid="summary-unsampled">{props.unsampled.length}</dd>
      </dl>
      {props.unsampled.length ? (
        <details>
          <summary className="min-h-12 cursor-pointer font-bold">Which fixtures</summary>
          <ul className="list-disc pl-6">
            {props.unsampled.map((f) => (
              <li key={f.id}>{f.label || FIXTURE_KIND_NAMES[f.kind]}</li>
            ))}
          </ul>
        </details>
      ) : null}
      {rejected.length ? (
        <p className="text-danger">
          {rejected.length} readings were refused by the server and need fixing first; they stay on this device.
        </p>
      ) : null}
      {props.waiting ? (
        <p>{props.waiting} changes are still waiting to upload. The sweep is submitted once they are in.</p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button onClick={props.onSubmit} className="min-h-12">
          Submit sweep
        </Button>
        <Button variant="secondary" onClick={props.onClose} className="min-h-12">
          Keep walking
        </Button>
      </div>
    </Dialog>
  );
}
