import { useState } from "react";
import { Button } from "../../../components/ui/button";
import { TextField } from "../../../components/ui/text-field";

/** Try another transport delay: the server recomputes (and caches) the map with it. */
export function DelayControl({
  detectorDelayS,
  current,
  onApply,
  busy,
}: {
  detectorDelayS: number;
  current: number;
  onApply(v: number | null): void;
  busy: boolean;
}) {
  const [text, setText] = useState(String(current));
  const value = Number(text);
  const error =
    text.trim() === "" || !Number.isFinite(value)
      ? "Enter a number of seconds"
      : value < 0 || value > 60
        ? "Between 0 and 60 s"
        : undefined;
  return (
    <form
      className="flex flex-wrap items-end gap-2 rounded-md edge bg-surface p-3"
      onSubmit={(e) => {
        e.preventDefault();
        if (!error) onApply(value === detectorDelayS ? null : value);
      }}
    >
      <TextField
        label="Transport delay (s)"
        hint={`The detector's is ${detectorDelayS} s.`}
        inputMode="decimal"
        value={text}
        onChange={(e) => setText(e.currentTarget.value)}
        error={error}
        className="w-48"
      />
      <Button type="submit" variant="secondary" busy={busy}>
        Recompute
      </Button>
      {current !== detectorDelayS ? (
        <Button
          variant="quiet"
          onClick={() => {
            setText(String(detectorDelayS));
            onApply(null);
          }}
        >
          Back to {detectorDelayS} s
        </Button>
      ) : null}
    </form>
  );
}
