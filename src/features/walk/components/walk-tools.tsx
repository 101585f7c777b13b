const TOOL =
  "flex min-h-12 min-w-12 flex-1 items-center justify-center rounded-md px-1 font-bold leading-tight edge disabled:opacity-50";

/** The Walk screen's toolbar; it stays while the keypad is open, so Submit is one tap away. */
export function WalkTools(props: {
  readOnly: boolean;
  canUndo: boolean;
  canSubmit: boolean;
  leakMode: boolean;
  onUndo(): void;
  onList(): void;
  onLeak(): void;
  onImport(): void;
  onSubmit(): void;
}) {
  return (
    <nav aria-label="Sweep tools" className="flex gap-2 bg-surface px-2 py-1 edge border-x-0 border-b-0">
      <button
        type="button"
        className={`${TOOL} bg-surface`}
        onClick={props.onUndo}
        disabled={props.readOnly || !props.canUndo}
      >
        Undo
      </button>
      <button type="button" className={`${TOOL} bg-surface`} onClick={props.onList}>
        Readings
      </button>
      <button
        type="button"
        className={`${TOOL} bg-surface`}
        onClick={props.onLeak}
        aria-pressed={props.leakMode}
        disabled={props.readOnly}
      >
        Leak here
      </button>
      <button type="button" className={`${TOOL} bg-surface`} onClick={props.onImport} disabled={props.readOnly}>
        Import log
      </button>
      <button
        type="button"
        className={`${TOOL} bg-accent text-on-accent`}
        onClick={props.onSubmit}
        disabled={!props.canSubmit}
      >
        Submit
      </button>
    </nav>
  );
}
