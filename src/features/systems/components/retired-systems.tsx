import { Link } from "react-router";
import type { System } from "#core/contracts/systems";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { retireReasonWords } from "#core/domain/compliance/retirement-words";

/**
 * The store's retired systems, each a way back to its records: a retired system leaves the table
 * of systems in service, but its records are kept and stay readable (docs/decisions/0040).
 */
export function RetiredSystems({ systems }: { systems: readonly System[] }) {
  if (systems.length === 0) return null;
  return (
    <section aria-labelledby="retired-systems-heading" className="space-y-1">
      <h3 id="retired-systems-heading" className="font-bold">
        Retired systems
      </h3>
      <p className="text-sm text-muted">Out of service; their records are kept and stay readable.</p>
      <ul className="space-y-1">
        {systems.map((s) => (
          <li key={s.id}>
            <Link className="text-accent underline" to={`/systems/${s.id}`}>
              {s.name}
            </Link>
            {s.retired
              ? ` — left service ${formatCalendarDay(s.retired.on)}${retireReasonWords(s.retired) ? ` (${retireReasonWords(s.retired)})` : ""}`
              : ""}
          </li>
        ))}
      </ul>
    </section>
  );
}
