import { useEffect, useRef, useState } from "react";
import { PPM_CEILING, SAMPLE_POINTS, SAMPLE_POINT_LABELS, type SamplePoint } from "#core/contracts/sweeps";
import { formatShort, type NumberFormat } from "#core/domain/numbers/number-format";

export interface KeypadValue {
  ppm: number;
  atLeast: boolean;
  samplePoint: SamplePoint;
  note: string;
}

export interface PpmKeypadProps {
  title: string;
  initial: KeypadValue;
  /** Recent values, newest first, offered as one-tap picks. */
  recent: readonly number[];
  onSave(value: KeypadValue): void;
  onCancel(): void;
  cancelLabel: string;
  /** A detector without a ppm display: its levels and the ppm band each stands for. */
  levels?: readonly { level: string; minPpm: number; maxPpm: number | null }[] | null;
  /** The keypad's typed text, lifted so a tap on the plan can save what is shown. */
  onTyped?(value: KeypadValue): void;
  /** Move this reading: the next tap on the plan places it. */
  onMove?(): void;
  /** The company's number format: the decimal key and the shown value use its decimal mark. */
  numberFormat?: NumberFormat;
}

const KEY =
  "flex h-12 min-w-12 items-center justify-center rounded-md text-2xl font-bold edge active:opacity-70 disabled:opacity-50";

/**
 * A compact ppm keypad for a gloved thumb: every key at least 48 × 48 px, in three rows. "0 ppm" saves a zero in
 * one tap; "Over range" stores the typed value as "at least" (a pegged display).
 */
export function PpmKeypad(props: PpmKeypadProps) {
  const format = props.numberFormat ?? "1,234.5";
  // The typed text keeps "." inside; only what the technician sees uses the company's mark.
  const mark = format === "1,234.5" ? "." : ",";
  const [typed, setTyped] = useState(props.initial.ppm === 0 ? "" : String(props.initial.ppm));
  const [atLeast, setAtLeast] = useState(props.initial.atLeast);
  const [samplePoint, setSamplePoint] = useState<SamplePoint>(props.initial.samplePoint);
  const [note, setNote] = useState(props.initial.note);
  const [noteOpen, setNoteOpen] = useState(props.initial.note !== "");
  // The sample point is remembered from the reading before: its choices open only when asked for.
  const [pointsOpen, setPointsOpen] = useState(false);
  const value = typed === "" || typed === "." ? 0 : Number(typed);
  const tooHigh = value > PPM_CEILING;

  function current(over = atLeast, v = value): KeypadValue {
    return { ppm: v, atLeast: over, samplePoint, note: note.trim() };
  }
  const onTyped = useRef(props.onTyped);
  onTyped.current = props.onTyped;
  useEffect(() => {
    onTyped.current?.({ ppm: value, atLeast, samplePoint, note: note.trim() });
  }, [value, atLeast, samplePoint, note]);
  function type(next: string) {
    setTyped(next);
  }
  function press(k: string) {
    if (k === "." && typed.includes(".")) return;
    if (typed.replace(".", "").length >= 6) return;
    type(typed === "0" && k !== "." ? k : typed + k);
  }

  const keys = (list: string[]) =>
    list.map((k) => (
      <button key={k} type="button" className={`${KEY} bg-surface`} onClick={() => press(k)}>
        {k}
      </button>
    ));

  return (
    <section
      aria-label="Enter the detector's reading"
      className="flex flex-col gap-1.5 bg-surface px-2 py-1.5 edge border-x-0 border-b-0"
      data-testid="ppm-keypad"
    >
      <div className="flex items-center gap-1.5">
        <h2 className="shrink-0 text-sm font-bold">{props.title}</h2>
        <output
          aria-live="polite"
          aria-label="Value"
          className={`block min-w-0 flex-1 truncate rounded-md px-2 text-right text-2xl font-bold leading-[3rem] edge ${tooHigh ? "border-danger text-danger" : ""}`}
        >
          {atLeast ? "≥ " : ""}
          {typed === "" ? "0" : typed.replace(".", mark)} <span className="text-base">ppm</span>
        </output>
        <button
          type="button"
          className="min-h-12 max-w-24 shrink-0 truncate rounded-md px-2 text-sm font-bold edge"
          aria-expanded={pointsOpen}
          aria-label={`Sample point: ${SAMPLE_POINT_LABELS[samplePoint]}. Change it`}
          onClick={() => setPointsOpen(!pointsOpen)}
        >
          {SAMPLE_POINT_LABELS[samplePoint]} ▾
        </button>
        {props.onMove ? (
          <button
            type="button"
            className="min-h-12 min-w-12 shrink-0 rounded-md px-1 text-sm font-bold edge"
            onClick={props.onMove}
          >
            Move
          </button>
        ) : null}
        <button
          type="button"
          className="min-h-12 shrink-0 rounded-md px-1 text-sm font-bold text-accent underline"
          onClick={props.onCancel}
        >
          {props.cancelLabel}
        </button>
      </div>
      {pointsOpen ? (
        <div role="radiogroup" aria-label="Sample point" className="flex gap-2 overflow-x-auto">
          {SAMPLE_POINTS.map((p) => (
            <button
              key={p}
              type="button"
              role="radio"
              aria-checked={samplePoint === p}
              onClick={() => {
                setSamplePoint(p);
                setPointsOpen(false);
              }}
              className={`min-h-12 shrink-0 rounded-full px-3 font-bold edge ${samplePoint === p ? "bg-accent text-on-accent" : "bg-surface"}`}
            >
              {SAMPLE_POINT_LABELS[p]}
            </button>
          ))}
        </div>
      ) : null}
      {tooHigh ? (
        <p className="text-danger">
          Above the {formatShort(PPM_CEILING, format)} ppm ceiling: enter the display's top value and press Over range.
        </p>
      ) : null}
      {props.recent.length ? (
        <div className="flex gap-2" aria-label="Recent values">
          {props.recent.map((v) => (
            <button
              key={v}
              type="button"
              className="min-h-12 flex-1 rounded-md font-bold edge bg-accent-soft"
              onClick={() => props.onSave(current(false, v))}
            >
              {String(v).replace(".", mark)} ppm
            </button>
          ))}
        </div>
      ) : null}
      {props.levels?.length ? (
        <div className="flex flex-wrap gap-2" aria-label="Detector levels">
          {props.levels.map((b) => (
            <button
              key={b.level}
              type="button"
              className="min-h-12 flex-1 rounded-md px-2 font-bold edge bg-note-soft"
              // A level says only that the concentration is in its band: stored as "at least" its floor.
              onClick={() =>
                props.onSave({
                  ppm: b.minPpm,
                  atLeast: b.minPpm > 0,
                  samplePoint,
                  note: [`Level ${b.level} (${b.minPpm}${b.maxPpm === null ? "+" : `–${b.maxPpm}`} ppm)`, note.trim()]
                    .filter(Boolean)
                    .join("; "),
                })
              }
            >
              Level {b.level}
            </button>
          ))}
        </div>
      ) : null}
      {/* Three rows of keys, six across (each still at least 48 px wide on a 360 px phone): the plan
          keeps about a third of a phone screen while a value is typed (docs/decisions/0091). */}
      <div className="grid grid-cols-6 gap-2">
        {keys(["1", "2", "3", "4", "5"])}
        <button
          type="button"
          className={`${KEY} bg-surface`}
          aria-label="Delete last digit"
          onClick={() => type(typed.slice(0, -1))}
        >
          ⌫
        </button>
        {keys(["6", "7", "8", "9", "0"])}
        <button type="button" className={`${KEY} bg-surface`} onClick={() => press(".")} aria-label="Decimal point">
          {mark}
        </button>
        <button
          type="button"
          className={`${KEY} col-span-2 bg-ok px-1 text-base leading-tight text-on-accent`}
          onClick={() => props.onSave({ ...current(false, 0) })}
        >
          0 ppm — save
        </button>
        <button
          type="button"
          aria-pressed={atLeast}
          className={`${KEY} px-0.5 text-xs leading-tight ${atLeast ? "bg-accent text-on-accent" : "bg-surface"}`}
          onClick={() => setAtLeast(!atLeast)}
        >
          Over range
        </button>
        <button
          type="button"
          className={`${KEY} bg-surface px-0.5 text-sm`}
          aria-expanded={noteOpen}
          onClick={() => setNoteOpen(!noteOpen)}
        >
          Note
        </button>
        <button
          type="button"
          className={`${KEY} col-span-2 bg-accent text-on-accent`}
          disabled={tooHigh}
          onClick={() => props.onSave(current())}
        >
          Save
        </button>
      </div>
      {noteOpen ? (
        <label className="block">
          <span className="font-bold">Note (optional)</span>
          <input
            value={note}
            maxLength={500}
            onChange={(e) => setNote(e.target.value)}
            className="mt-1 block min-h-12 w-full rounded-md px-3 edge"
          />
        </label>
      ) : null}
    </section>
  );
}
