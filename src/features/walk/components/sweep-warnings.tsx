import { useState, type ReactNode } from "react";
import type { SweepWarning } from "#core/contracts/sweeps";
import { StripChip, useFoldedStrip } from "./notice-strip";

/** The sync banner (children) with the sweep's warnings beside it, opened on a tap. */
export function SweepWarnings({ warnings, children }: { warnings: readonly SweepWarning[]; children: ReactNode }) {
  const folded = useFoldedStrip();
  const [open, setOpen] = useState(false);
  const count = `${warnings.length} ${warnings.length === 1 ? "warning" : "warnings"}`;
  if (folded)
    return (
      <>
        {children}
        {warnings.length ? <StripChip tone="note">{count}</StripChip> : null}
      </>
    );
  return (
    <>
      <div className="flex gap-2">
        <div className="min-w-0 flex-1">{children}</div>
        {warnings.length ? (
          <button
            type="button"
            aria-expanded={open}
            onClick={() => setOpen(!open)}
            className="min-h-12 shrink-0 rounded-md border-l-4 border-note bg-note-soft px-3 font-bold text-note edge"
          >
            {count}
          </button>
        ) : null}
      </div>
      {open ? (
        <ul className="max-h-48 overflow-auto">
          {warnings.map((w) => (
            <li
              key={w.code + (w.systemId ?? "")}
              className="mb-1 rounded-md border-l-4 border-note bg-note-soft px-3 py-1 text-note edge"
            >
              {w.message}
            </li>
          ))}
        </ul>
      ) : null}
    </>
  );
}
