import { useState } from "react";
import type { CompanyRefrigerantView } from "#core/contracts/company-refrigerants";
import type { NumberFormat } from "#core/domain/numbers/number-format";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { QueryError } from "../../../components/ui/query-error";
import { Spinner } from "../../../components/ui/spinner";
import { formErrorMessage } from "../../../lib/form-errors";
import {
  useCompanyRefrigerants,
  useDeleteCompanyRefrigerant,
  useSetCompanyRefrigerantRetired,
} from "../api/company-refrigerants";
import { CompanyRefrigerantForm } from "./company-refrigerant-form";

function madeOf(r: CompanyRefrigerantView): string {
  if (r.composition) return r.composition.map((c) => `${c.refrigerantId} ${c.massPercent} %`).join(", ");
  return r.statedGwp ? `GWP ${r.statedGwp.value} stated on ${r.statedGwp.basis} (${r.statedGwp.source})` : "";
}

/**
 * The company's own refrigerants, under the store's systems: what each is, its GWP on the company's
 * basis, how many systems use it. Owners and lead techs enter, retire and bring back; one no system
 * ever used may be deleted. A refrigerant in use is never deleted: its records keep naming it.
 */
export function CompanyRefrigerantsPanel({ canEdit, numberFormat }: { canEdit: boolean; numberFormat?: NumberFormat }) {
  const list = useCompanyRefrigerants();
  const [adding, setAdding] = useState(false);
  const [saved, setSaved] = useState<string | null>(null);
  const retire = useSetCompanyRefrigerantRetired();
  const del = useDeleteCompanyRefrigerant();
  const actionError = formErrorMessage(retire.error) ?? formErrorMessage(del.error);
  return (
    <section aria-labelledby="own-refrigerants-heading" className="space-y-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id="own-refrigerants-heading" className="text-lg font-bold">
          Refrigerants entered by the company
        </h3>
        {canEdit && !adding ? (
          <Button
            variant="secondary"
            onClick={() => {
              setSaved(null);
              setAdding(true);
            }}
          >
            Enter a refrigerant
          </Button>
        ) : null}
      </div>
      {saved ? <Alert tone="success">{saved} was saved: pick it for a system in the refrigerant list.</Alert> : null}
      {actionError ? <Alert tone="error">{actionError}</Alert> : null}
      {adding ? (
        <CompanyRefrigerantForm
          numberFormat={numberFormat}
          onDone={(name) => {
            setAdding(false);
            setSaved(name);
          }}
          onCancel={() => setAdding(false)}
        />
      ) : null}
      {list.isPending ? <Spinner label="Loading the company's refrigerants…" /> : null}
      {list.isError ? (
        <QueryError error={list.error} what="the company's refrigerants" onRetry={() => void list.refetch()} />
      ) : null}
      {list.data && list.data.length === 0 ? (
        <p className="text-sm text-muted">None yet: every system uses a refrigerant from the catalogue.</p>
      ) : null}
      <ul className="space-y-2">
        {list.data?.map((r) => (
          <li key={r.rowId} className="rounded-md bg-surface p-3 edge">
            <p>
              <span className="font-bold">{r.summary.designation}</span> · {r.safetyClass} · entered by the company
              {r.retired ? " · retired" : ""}
            </p>
            <p className="text-sm text-muted">{madeOf(r)}</p>
            <p className="text-sm text-muted">
              {r.summary.gwp
                ? `GWP ${r.summary.gwp.value} (${r.summary.gwp.basis}); basis: ${r.summary.gwp.statement}.`
                : `GWP not known on the company's basis${r.summary.gwpNote ? `: ${r.summary.gwpNote}` : ""}.`}{" "}
              Used by {r.systemsUsing} system{r.systemsUsing === 1 ? "" : "s"}.
            </p>
            {canEdit ? (
              <div className="mt-2 flex flex-wrap gap-2">
                <Button
                  variant="secondary"
                  busy={retire.isPending && retire.variables?.rowId === r.rowId}
                  onClick={() => retire.mutate({ rowId: r.rowId, retired: !r.retired })}
                  aria-label={`${r.retired ? "Bring back" : "Retire"} ${r.summary.designation}`}
                >
                  {r.retired ? "Bring back" : "Retire"}
                </Button>
                {r.systemsUsing === 0 ? (
                  <Button
                    variant="quiet"
                    busy={del.isPending && del.variables?.rowId === r.rowId}
                    onClick={() => del.mutate({ rowId: r.rowId })}
                    aria-label={`Delete ${r.summary.designation}`}
                  >
                    Delete
                  </Button>
                ) : null}
              </div>
            ) : null}
          </li>
        ))}
      </ul>
    </section>
  );
}
