import type { SaveState } from "../../hooks/use-autosave";
import { Button } from "../../../../components/ui/button";

const TEXT: Record<SaveState["status"], string> = {
  saved: "All changes saved",
  unsaved: "Unsaved changes…",
  saving: "Saving…",
  invalid: "Not saved: fix the marked problems",
  conflict: "Not saved: someone else changed this layout",
  failed: "Not saved: the save failed",
};

const MARK: Record<SaveState["status"], string> = {
  saved: "✓",
  unsaved: "•",
  saving: "↻",
  invalid: "!",
  conflict: "!",
  failed: "!",
};

/** The save state in words and a mark (never colour alone), announced politely. */
export function SaveStatus({ state, onRetry }: { state: SaveState; onRetry: () => void }) {
  const bad = state.status === "invalid" || state.status === "conflict" || state.status === "failed";
  return (
    <div
      role="status"
      aria-live="polite"
      data-save-status={state.status}
      title={TEXT[state.status]}
      className={`flex min-h-11 shrink-0 items-center gap-2 rounded-md px-3 font-bold edge ${bad ? "border-danger bg-danger-soft text-danger" : "bg-surface"}`}
    >
      <span aria-hidden="true">{MARK[state.status]}</span>
      {/* On a phone the words of a good state make room for the tools; a problem always says itself. */}
      <span className={bad ? "" : "sr-only sm:not-sr-only"}>{TEXT[state.status]}</span>
      {state.status === "failed" ? (
        <Button variant="quiet" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </div>
  );
}
