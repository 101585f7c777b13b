import { Button } from "../../../components/ui/button";
import { TextField } from "../../../components/ui/text-field";
import type { LevelRow } from "../model/level-rows";

/**
 * The level scale of a detector without a ppm display: each level it shows and the ppm band it
 * stands for, from low to high. Errors come by row and field ("1.minPpm").
 */
export function LevelScaleEditor({
  rows,
  errors,
  onChange,
}: {
  rows: readonly LevelRow[];
  errors: Record<string, string>;
  onChange(rows: LevelRow[]): void;
}) {
  const set = (i: number, patch: Partial<LevelRow>) => onChange(rows.map((r, k) => (k === i ? { ...r, ...patch } : r)));
  const add = () => {
    const last = rows[rows.length - 1];
    onChange([...rows, { level: String(rows.length + 1), minPpm: last?.maxPpm ?? "", maxPpm: "" }]);
  };
  return (
    <fieldset className="sm:col-span-2">
      <legend className="font-bold">Level scale (for a detector without a ppm display)</legend>
      <p className="text-sm text-muted">
        From the lowest level to the highest; a level may start where the one below ends. Leave the top level's upper
        bound blank for "and above". The keypad offers these levels and stores each as at least its lower bound.
      </p>
      <ol className="mt-2 flex flex-col gap-2">
        {rows.map((r, i) => (
          <li
            key={i}
            className="grid grid-cols-2 items-start gap-2 rounded-md p-2 edge sm:grid-cols-[1fr_1fr_1fr_auto]"
            data-testid="level-row"
          >
            <TextField
              label={`Level ${i + 1} name`}
              value={r.level}
              maxLength={20}
              onChange={(e) => set(i, { level: e.target.value })}
              error={errors[`${i}.level`]}
            />
            <TextField
              label={`Level ${i + 1} from (ppm)`}
              inputMode="decimal"
              value={r.minPpm}
              onChange={(e) => set(i, { minPpm: e.target.value })}
              error={errors[`${i}.minPpm`]}
            />
            <TextField
              label={`Level ${i + 1} up to (ppm)`}
              inputMode="decimal"
              value={r.maxPpm}
              placeholder={i === rows.length - 1 ? "and above" : ""}
              onChange={(e) => set(i, { maxPpm: e.target.value })}
              error={errors[`${i}.maxPpm`]}
            />
            <Button
              variant="quiet"
              className="min-h-12 self-end"
              onClick={() => onChange(rows.filter((_, k) => k !== i))}
              aria-label={`Remove level ${i + 1}`}
            >
              Remove
            </Button>
          </li>
        ))}
      </ol>
      <Button variant="secondary" className="mt-2 min-h-12" onClick={add} disabled={rows.length >= 20}>
        Add a level
      </Button>
    </fieldset>
  );
}
