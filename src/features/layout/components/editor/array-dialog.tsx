import { useEffect, useRef, useState, type FormEvent } from "react";
import type { LengthPreference } from "#core/domain/units/format-units";
import { formatLength } from "#core/domain/units/format-units";
import { toMetres } from "#core/analysis/geometry/units";
import { Button } from "../../../../components/ui/button";
import { Select } from "../../../../components/ui/select";
import { TextField } from "../../../../components/ui/text-field";
import type { Vec } from "#core/analysis/geometry/types";
import { readLengthEntry } from "../../model/length-entry";

const DIRECTIONS: Record<string, { label: string; vec: Vec }> = {
  right: { label: "To the right", vec: [1, 0] },
  down: { label: "Downwards", vec: [0, 1] },
  left: { label: "To the left", vec: [-1, 0] },
  up: { label: "Upwards", vec: [0, -1] },
};

/**
 * "Array": a row of identical cases. The spacing is centre to centre and starts at the
 * selection's own width (or depth), so the copies butt end to end unless told otherwise.
 */
export function ArrayDialog({
  size,
  preference,
  onArray,
  onClose,
}: {
  size: { width: number; depth: number };
  preference: LengthPreference;
  onArray: (count: number, spacingM: number, direction: Vec) => void;
  onClose: () => void;
}) {
  const [count, setCount] = useState("4");
  const box = useRef<HTMLDivElement>(null);
  // Below xl the panel sits under the stage, often off screen on a tablet: bring it into view.
  useEffect(() => {
    box.current?.scrollIntoView?.({ block: "nearest" });
  }, []);
  const [direction, setDirection] = useState("right");
  const along = direction === "right" || direction === "left" ? size.width : size.depth;
  const [spacing, setSpacing] = useState<string | null>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  // In the member's units (feet and inches to 1/16 in); untouched, the exact width is used.
  const spacingText = spacing ?? formatLength(along, preference, { decimals: 3, denominator: 16 });

  function submit(e: FormEvent) {
    e.preventDefault();
    const n = Number(count);
    const next: Record<string, string> = {};
    if (!(Number.isInteger(n) && n >= 2 && n <= 200)) next.count = "must be a whole number from 2 to 200";
    const s = spacing === null ? null : readLengthEntry(spacing, preference);
    if (s && !s.ok) next.spacing = s.message;
    setErrors(next);
    if (Object.keys(next).length || (s && !s.ok)) return;
    onArray(n, s ? toMetres(s.length.value, s.length.unit) : along, DIRECTIONS[direction].vec);
  }

  return (
    <div
      ref={box}
      role="dialog"
      aria-modal="false"
      aria-labelledby="array-heading"
      className="space-y-3 rounded-md bg-surface p-4 shadow-lg edge"
    >
      <h3 id="array-heading" className="text-lg font-bold">
        Make a row of copies
      </h3>
      <form onSubmit={submit} noValidate className="space-y-3">
        <TextField
          label="Items in the row, with the selected"
          inputMode="numeric"
          value={count}
          onChange={(e) => setCount(e.target.value)}
          error={errors.count}
        />
        <Select
          label="Direction"
          value={direction}
          onChange={(e) => {
            setDirection(e.target.value);
            setSpacing(null);
          }}
          options={Object.entries(DIRECTIONS).map(([value, d]) => ({ value, label: d.label }))}
        />
        <TextField
          label="Spacing, centre to centre"
          hint={`The selection is ${formatLength(along, preference)} along this direction: that spacing puts them end to end.`}
          value={spacingText}
          onChange={(e) => setSpacing(e.target.value)}
          error={errors.spacing}
        />
        <div className="flex flex-wrap gap-2">
          <Button type="submit">Make copies</Button>
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
        </div>
      </form>
    </div>
  );
}
