import { useEffect, useRef, useState } from "react";

/**
 * Says, in a status region, that the field map is being recomputed and then that it is up to
 * date, so a recompute that takes a while is never silent (a screen reader hears both).
 */
export function AnalysisProgress({ working, computedAt }: { working: boolean; computedAt: string | null }) {
  const was = useRef(working);
  const [done, setDone] = useState(false);
  useEffect(() => {
    if (was.current && !working) setDone(true);
    if (working) setDone(false);
    was.current = working;
  }, [working]);
  return (
    <p
      role="status"
      aria-live="polite"
      data-testid="analysis-progress"
      className={working || done ? "rounded bg-surface px-2 text-sm font-bold edge" : "sr-only"}
    >
      {working
        ? "Recomputing the field map…"
        : done && computedAt
          ? `The field map is up to date (computed ${computedAt}).`
          : ""}
    </p>
  );
}
