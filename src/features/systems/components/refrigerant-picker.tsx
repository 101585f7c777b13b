import { useId } from "react";
import type { RefrigerantSummary } from "#core/contracts/systems";
import { FieldError } from "../../../components/ui/field-error";
import { SourceText } from "../../../components/ui/source-text";

/** An R-number picker that shows, for the choice, its safety class and its GWP with basis and source. */
export function RefrigerantPicker({
  refrigerants,
  value,
  onChange,
  error,
}: {
  refrigerants: readonly RefrigerantSummary[];
  value: string;
  onChange: (id: string) => void;
  error?: string;
}) {
  const id = useId();
  const picked = refrigerants.find((r) => r.id === value) ?? null;
  const groups = [
    { label: "Catalogue", list: refrigerants.filter((r) => !r.enteredByCompany) },
    { label: "Entered by the company", list: refrigerants.filter((r) => r.enteredByCompany) },
  ];
  return (
    <div>
      <label htmlFor={id} className="block font-bold">
        Refrigerant
      </label>
      <select
        id={id}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={`${id}-facts`}
        className={`mt-1 block min-h-11 w-full rounded-md bg-surface px-3 py-2 text-ink edge ${error ? "border-danger" : ""}`}
      >
        <option value="">Choose a refrigerant…</option>
        {groups.map((g) =>
          g.list.length === 0 ? null : (
            <optgroup key={g.label} label={g.label}>
              {g.list.map((r) => (
                <option key={r.id} value={r.id}>
                  {r.designation} · {r.safetyClass}
                  {r.gwp ? ` · GWP ${r.gwp.value}` : ""}
                </option>
              ))}
            </optgroup>
          ),
        )}
      </select>
      <div id={`${id}-facts`} className="mt-1 text-sm text-muted" aria-live="polite">
        {picked ? (
          <>
            <p>
              {picked.enteredByCompany ? `${picked.designation}, entered by the company` : picked.name}: safety class{" "}
              <span className="font-bold text-ink">{picked.safetyClass}</span> (
              <SourceText source={picked.safetyClassSource} />
              ).
            </p>
            <p>
              {picked.gwp ? (
                <>
                  GWP-100 <span className="font-bold text-ink">{picked.gwp.value}</span> on the {picked.gwp.basis} basis
                  (<SourceText source={picked.gwp.source} />){picked.gwpNote ? `; ${picked.gwpNote}` : ""}.
                  <span className="block">GWP basis of the company's rule profile: {picked.gwp.statement}.</span>
                </>
              ) : (
                <>
                  GWP not known on the company's basis
                  {picked.gwpNote ? (
                    <>
                      : <SourceText source={picked.gwpNote} />
                    </>
                  ) : (
                    ""
                  )}
                  .
                </>
              )}
            </p>
          </>
        ) : null}
      </div>
      <FieldError id={`${id}-error`} label="Refrigerant" message={error} />
    </div>
  );
}
