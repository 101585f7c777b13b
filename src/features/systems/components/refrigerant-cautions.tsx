import type { Caution } from "#core/contracts/systems";
import { readableSource } from "#core/domain/compliance/citations";
import { SourceText } from "../../../components/ui/source-text";

/**
 * The usual cautions for the picked refrigerant, beside the form. They inform; local codes and
 * certified practice govern, and the list says so.
 */
export function RefrigerantCautions({
  refrigerantName,
  cautions,
}: {
  refrigerantName: string | null;
  cautions: readonly Caution[];
}) {
  return (
    <aside
      aria-labelledby="cautions-heading"
      className="space-y-3 rounded-md border-l-4 border-note bg-note-soft p-4 edge"
    >
      <h3 id="cautions-heading" className="font-bold">
        {refrigerantName ? `Working safely with ${refrigerantName}` : "Safety cautions"}
      </h3>
      {refrigerantName === null ? <p>Pick a refrigerant to see the cautions for its safety class.</p> : null}
      <ul className="space-y-2">
        {cautions.map((c) => (
          <li key={c.id}>
            <p>
              <span className="font-bold">{c.level === "warning" ? "Warning: " : "Note: "}</span>
              {c.text}
            </p>
            {readableSource(c.source) ? (
              <p className="text-sm text-muted">
                Source: <SourceText source={c.source} />
              </p>
            ) : null}
          </li>
        ))}
      </ul>
      <p className="font-bold">
        These are the usual cautions only. Local codes and certified practice govern the work.
      </p>
    </aside>
  );
}
