import { useState } from "react";
import { setHighContrast, storedHighContrast } from "../../lib/contrast";

/** A switch, not a link: its state is read out as pressed or not. */
export function ContrastToggle() {
  const [on, setOn] = useState(storedHighContrast);
  return (
    <button
      type="button"
      aria-pressed={on}
      onClick={() => {
        setHighContrast(!on);
        setOn(!on);
      }}
      className="inline-flex min-h-11 items-center rounded-md bg-surface px-3 font-bold text-ink edge hover:bg-accent-soft"
    >
      High contrast{on ? ": on" : ""}
    </button>
  );
}
