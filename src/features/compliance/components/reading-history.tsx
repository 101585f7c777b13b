import type { ReadingsResponse } from "#core/contracts/compliance";

type History = ReadingsResponse["readings"][number]["history"];

const day = (iso: string) => iso.slice(0, 10);

/** Every acceptance and withdrawal of a reading, oldest first: history keeps both, never deletes. */
export function ReadingHistory({ history }: { history: History }) {
  if (history.length < 2) return null;
  return (
    <details className="mt-2 text-sm">
      <summary className="min-h-11 cursor-pointer py-2">History ({history.length})</summary>
      <ol className="list-decimal space-y-1 pl-6 text-muted">
        {history.map((h, i) => (
          <li key={i}>
            {h.kind === "accepted" ? "Accepted" : "Withdrawn"} by {h.by} on {day(h.at)}
            {h.note ? (h.kind === "accepted" ? ` (${h.note})` : `: ${h.note}`) : ""}.
          </li>
        ))}
      </ol>
    </details>
  );
}
