import { useState } from "react";
import { PRINCIPLE_LABELS, SENSING_PRINCIPLES, type Detector, type DetectorInput } from "#core/contracts/detectors";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { Select } from "../../../components/ui/select";
import { TextField } from "../../../components/ui/text-field";
import { isApiRequestError } from "../../../lib/api-client";
import { fieldErrorSummary } from "../../../lib/form-errors";
import { useSaveDetector } from "../api/detectors-api";
import { parseRows, toRows, type LevelRow } from "../model/level-rows";
import { LevelScaleEditor } from "./level-scale-editor";

/** Create or edit a detector. Defaults (5 s delay, 2 ppm alarm) are common practice, no published source. */
export function DetectorForm({ existing, onDone }: { existing: Detector | null; onDone(): void }) {
  const [name, setName] = useState(existing?.name ?? "");
  const [principle, setPrinciple] = useState<DetectorInput["principle"]>(existing?.principle ?? "heated-diode");
  const [delay, setDelay] = useState(String(existing?.transportDelayS ?? 5));
  const [tau, setTau] = useState(String(existing?.timeConstantS ?? 1.5));
  const [alarm, setAlarm] = useState(String(existing?.alarmPpm ?? 2));
  const [checked, setChecked] = useState(existing?.lastCheckedOn ?? "");
  const [levels, setLevels] = useState<LevelRow[]>(toRows(existing?.levelScale ?? null));
  const [levelErrors, setLevelErrors] = useState<Record<string, string>>({});
  const save = useSaveDetector();
  const fields = isApiRequestError(save.error) ? save.error.fields : {};
  // The server's paths are "levelScale.1.minPpm"; the editor's are "1.minPpm".
  const serverLevelErrors = Object.fromEntries(
    Object.entries(fields)
      .filter(([k]) => k.startsWith("levelScale."))
      .map(([k, m]) => [k.slice("levelScale.".length), m]),
  );

  return (
    <form
      className="grid max-w-2xl gap-3 sm:grid-cols-2"
      onSubmit={(e) => {
        e.preventDefault();
        const parsed = parseRows(levels);
        setLevelErrors(parsed.problems);
        if (Object.keys(parsed.problems).length) return;
        save.mutate(
          {
            id: existing?.id ?? null,
            input: {
              name,
              principle,
              transportDelayS: Number(delay),
              timeConstantS: Number(tau),
              alarmPpm: Number(alarm),
              lastCheckedOn: checked || null,
              levelScale: parsed.bands.length ? parsed.bands : null,
            },
          },
          { onSuccess: onDone },
        );
      }}
    >
      <TextField label="Name" value={name} onChange={(e) => setName(e.target.value)} error={fields.name} />
      <Select
        label="Sensing principle"
        value={principle}
        onChange={(e) => setPrinciple(e.target.value as DetectorInput["principle"])}
        options={SENSING_PRINCIPLES.map((p) => ({ value: p, label: PRINCIPLE_LABELS[p] }))}
        error={fields.principle}
      />
      <TextField
        label="Transport delay (s)"
        inputMode="decimal"
        value={delay}
        onChange={(e) => setDelay(e.target.value)}
        error={fields.transportDelayS}
        hint="Hose and pump: time from the probe tip to the sensor"
      />
      <TextField
        label="Response time constant (s)"
        inputMode="decimal"
        value={tau}
        onChange={(e) => setTau(e.target.value)}
        error={fields.timeConstantS}
      />
      <TextField
        label="Alarm level (ppm)"
        inputMode="decimal"
        value={alarm}
        onChange={(e) => setAlarm(e.target.value)}
        error={fields.alarmPpm}
      />
      <TextField
        label="Last calibration / bump check"
        type="date"
        value={checked}
        onChange={(e) => setChecked(e.target.value)}
        error={fields.lastCheckedOn}
      />
      <LevelScaleEditor
        rows={levels}
        errors={{ ...serverLevelErrors, ...levelErrors }}
        onChange={(rows) => {
          setLevels(rows);
          setLevelErrors({});
          if (save.isError) save.reset();
        }}
      />
      {Object.keys(levelErrors).length ? (
        <Alert tone="error">{fieldErrorSummary(levelRowErrors(levelErrors))}</Alert>
      ) : null}
      {save.isError && !Object.keys(fields).length ? <Alert tone="error">{save.error.message}</Alert> : null}
      <div className="flex gap-2 sm:col-span-2">
        <Button type="submit" busy={save.isPending}>
          {existing ? "Save changes" : "Add detector"}
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** Row problems ("1.minPpm") named for the reader: "Level 2 min ppm must be …". */
function levelRowErrors(problems: Record<string, string>): Record<string, string> {
  return Object.fromEntries(Object.entries(problems).map(([key, message]) => [`level.${key}`, message]));
}
