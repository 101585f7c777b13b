import { useState } from "react";
import { APPLIANCE_TYPE_NAMES, type System } from "#core/contracts/systems";
import { formatQuantity, type NumberFormat } from "#core/domain/numbers/number-format";
import type { MassPreference } from "#core/domain/units/format-units";
import { kgToPounds } from "#core/domain/units/mass";
import { Alert } from "../../../components/ui/alert";
import { Button } from "../../../components/ui/button";
import { DataTable } from "../../../components/ui/data-table";
import { EmptyState } from "../../../components/ui/empty-state";
import { QueryError } from "../../../components/ui/query-error";
import { Spinner } from "../../../components/ui/spinner";
import { formErrorMessage } from "../../../lib/form-errors";
import { useDeleteSystem } from "../api/delete-system";
import { useRetiredSystems, useSystems } from "../../../entities/systems/systems-api";
import { RetiredSystems } from "./retired-systems";
import { RetireSystemDialog } from "./retire-system-dialog";
import { SystemForm } from "./system-form";
import { CompanyRefrigerantsPanel } from "./company-refrigerants-panel";

/** The store page's systems: racks and condensing units with refrigerant, charge and detection. */
export function SystemsSection({
  storeId,
  canEdit,
  canRevise = false,
  rules = "us",
  massUnit,
  numberFormat = "1,234.5",
}: {
  storeId: string;
  canEdit: boolean;
  /** Engineers and owners change dated facts by a revision (docs/decisions/0043-system-revisions.md). */
  canRevise?: boolean;
  /** Whose rules the company works under (the EU profile asks about hermetically sealed units). */
  rules?: "us" | "eu";
  massUnit: MassPreference;
  numberFormat?: NumberFormat;
}) {
  const systems = useSystems(storeId);
  const retired = useRetiredSystems(storeId);
  const [editing, setEditing] = useState<string | "new" | null>(null);
  const [confirmDelete, setConfirmDelete] = useState<string | null>(null);
  const [retiring, setRetiring] = useState<System | null>(null);
  const del = useDeleteSystem();
  const editedSystem = systems.data?.find((s) => s.id === editing);
  const deleteError = formErrorMessage(del.error);

  return (
    <section aria-labelledby="systems-heading" className="space-y-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="systems-heading" className="text-xl font-bold">
          Systems
        </h2>
        {canEdit && editing === null ? <Button onClick={() => setEditing("new")}>Add system</Button> : null}
      </div>
      {systems.isPending ? <Spinner label="Loading systems…" /> : null}
      {systems.isError ? (
        <QueryError error={systems.error} what="the systems" onRetry={() => void systems.refetch()} />
      ) : null}
      {deleteError ? <Alert tone="error">{deleteError}</Alert> : null}
      <RetireSystemDialog system={retiring} onClose={() => setRetiring(null)} />
      {editing === "new" || editedSystem ? (
        <SystemForm
          key={editing}
          storeId={storeId}
          system={editedSystem}
          massUnit={massUnit}
          numberFormat={numberFormat}
          canRevise={canRevise}
          rules={rules}
          onDone={() => setEditing(null)}
          onCancel={() => setEditing(null)}
        />
      ) : null}
      {systems.data && systems.data.length === 0 && editing === null ? (
        <EmptyState title="No systems yet">
          Add the store's racks and condensing units, so fixtures can be linked to them and leak rates worked out.
        </EmptyState>
      ) : null}
      {systems.data?.[0]?.refrigerant.gwp ? (
        <p className="text-sm text-muted">GWP basis: {systems.data[0].refrigerant.gwp.statement}.</p>
      ) : null}
      {systems.data && systems.data.length > 0 ? (
        <DataTable<System>
          caption="Systems"
          rows={systems.data}
          rowKey={(s) => s.id}
          search="Search systems"
          initialSort={{ header: "System" }}
          columns={[
            {
              header: "System",
              cell: (s) => <span className="font-bold">{s.name}</span>,
              sortValue: (s) => s.name,
              searchText: (s) => `${s.name} ${s.refrigerant.designation} ${APPLIANCE_TYPE_NAMES[s.applianceType]}`,
            },
            {
              header: "Refrigerant",
              sortValue: (s) => s.refrigerant.designation,
              filterValue: (s) => s.refrigerant.designation,
              cell: (s) => (
                <>
                  {s.refrigerant.designation} <span className="text-muted">({s.refrigerant.safetyClass})</span>
                  {s.refrigerant.enteredByCompany ? (
                    <span className="block text-sm text-muted">entered by the company</span>
                  ) : null}
                </>
              ),
            },
            {
              header: "GWP",
              cell: (s) =>
                s.refrigerant.gwp ? (
                  <span title={`GWP basis: ${s.refrigerant.gwp.statement}`}>
                    {s.refrigerant.gwp.value} ({s.refrigerant.gwp.basis})
                  </span>
                ) : (
                  "not known"
                ),
            },
            {
              header: "Full charge",
              cell: (s) =>
                `${formatQuantity(massUnit === "lb" ? kgToPounds(s.fullChargeKg) : s.fullChargeKg, numberFormat, 1)} ${massUnit}`,
              sortValue: (s) => s.fullChargeKg,
            },
            {
              header: "Appliance type",
              cell: (s) => APPLIANCE_TYPE_NAMES[s.applianceType],
              filterValue: (s) => APPLIANCE_TYPE_NAMES[s.applianceType],
            },
            { header: "Automatic leak detection", cell: (s) => (s.automaticLeakDetection ? "Yes" : "No") },
            ...(rules === "eu"
              ? [{ header: "Hermetically sealed", cell: (s: System) => (s.hermeticallySealed ? "Yes" : "No") }]
              : []),
            ...(canEdit || canRevise
              ? [
                  {
                    header: "Actions",
                    className: "min-w-72",
                    cell: (s: System) =>
                      confirmDelete === s.id ? (
                        <div className="flex flex-wrap items-center gap-2">
                          <span className="text-sm text-muted">No record names it: it is deleted for good.</span>
                          <Button
                            variant="danger"
                            busy={del.isPending}
                            onClick={() =>
                              del.mutate({ id: s.id, storeId }, { onSettled: () => setConfirmDelete(null) })
                            }
                          >
                            Delete {s.name}
                          </Button>
                          <Button variant="secondary" onClick={() => setConfirmDelete(null)}>
                            Keep
                          </Button>
                        </div>
                      ) : (
                        <div className="flex flex-wrap gap-2">
                          <Button variant="secondary" onClick={() => setEditing(s.id)} aria-label={`Edit ${s.name}`}>
                            Edit
                          </Button>
                          {canEdit ? (
                            <Button variant="quiet" onClick={() => setRetiring(s)} aria-label={`Retire ${s.name}…`}>
                              Retire system…
                            </Button>
                          ) : null}
                          {/* Only a system no record names may be deleted (docs/decisions/0040, 0124). */}
                          {canEdit && !s.hasRecords ? (
                            <Button
                              variant="quiet"
                              onClick={() => setConfirmDelete(s.id)}
                              aria-label={`Delete ${s.name}`}
                            >
                              Delete
                            </Button>
                          ) : null}
                          {canEdit && s.hasRecords ? (
                            <span className="self-center text-sm text-muted">has records: retire, not delete</span>
                          ) : null}
                        </div>
                      ),
                  },
                ]
              : []),
          ]}
        />
      ) : null}
      <RetiredSystems systems={retired.data ?? []} />
      <details className="rounded-md bg-paper p-3 edge">
        <summary className="min-h-11 cursor-pointer py-2 font-bold">Refrigerant not in the catalogue?</summary>
        <CompanyRefrigerantsPanel canEdit={canEdit} numberFormat={numberFormat} />
      </details>
    </section>
  );
}
