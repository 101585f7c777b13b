import { readableSource } from "#core/domain/compliance/citations";
import { SourceText } from "./source-text";

export interface CautionItem {
  id: string;
  level: "warning" | "notice";
  text: string;
  source: string;
}

/** The usual cautions where the risk is: warnings first, and the last one defers to local codes. */
export function Cautions({ items, title = "Safety" }: { items: readonly CautionItem[]; title?: string }) {
  if (items.length === 0) return null;
  return (
    <section aria-label={title} className="rounded-md border-l-4 border-note bg-note-soft px-4 py-3 edge">
      <h2 className="font-bold">{title}</h2>
      <ul className="mt-1 list-disc space-y-1 pl-5">
        {items.map((c) => (
          <li key={c.id} className={c.level === "warning" ? "font-bold" : undefined}>
            <span className={c.level === "warning" ? "" : "font-normal"}>{c.text}</span>{" "}
            {readableSource(c.source) ? (
              <span className="text-sm font-normal text-muted">
                (<SourceText source={c.source} />)
              </span>
            ) : null}
          </li>
        ))}
      </ul>
    </section>
  );
}
