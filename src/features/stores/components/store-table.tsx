import { useState } from "react";
import { Link } from "react-router";
import type { Store } from "#core/contracts/stores";
import { Checkbox } from "../../../components/ui/checkbox";
import { DataTable } from "../../../components/ui/data-table";
import { EmptyState } from "../../../components/ui/empty-state";
import { QueryError } from "../../../components/ui/query-error";
import { Select } from "../../../components/ui/select";
import { Spinner } from "../../../components/ui/spinner";
import { TextField } from "../../../components/ui/text-field";
import { formatDateInZone } from "../model/store-time";
import { useStores } from "../../../entities/stores/stores-api";
import type { StoreListFilter } from "../../../entities/stores/stores-keys";

const SORTS = [
  { value: "name-asc", label: "Name, A to Z" },
  { value: "name-desc", label: "Name, Z to A" },
  { value: "created-desc", label: "Newest first" },
  { value: "created-asc", label: "Oldest first" },
];

/** The stores of the company (or the ones shared with a store contact), searchable and sortable. */
export function StoreTable({ scoped }: { scoped: boolean }) {
  const [search, setSearch] = useState("");
  const [sort, setSort] = useState("name-asc");
  const [includeArchived, setIncludeArchived] = useState(false);
  const [by, order] = sort.split("-") as [NonNullable<StoreListFilter["sort"]>, NonNullable<StoreListFilter["order"]>];
  const query = useStores({ search: search.trim() || undefined, sort: by, order, includeArchived });
  // The server leaves archived stores out unless asked; the list holds to that too.
  const rows = query.data?.filter((s) => includeArchived || s.archivedAt === null);
  const stores = { ...query, data: rows };

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-4">
        <TextField
          label="Search stores"
          type="search"
          value={search}
          onChange={(e) => setSearch(e.target.value)}
          className="min-w-64 flex-1"
          hint="By name or address"
        />
        <Select label="Sort" options={SORTS} value={sort} onChange={(e) => setSort(e.target.value)} className="w-48" />
        <Checkbox
          label="Show archived stores"
          checked={includeArchived}
          onChange={(e) => setIncludeArchived(e.target.checked)}
        />
      </div>
      {stores.isPending ? <Spinner label="Loading stores…" /> : null}
      {stores.isError ? (
        <QueryError error={stores.error} what="the stores" onRetry={() => void stores.refetch()} />
      ) : null}
      {stores.data && stores.data.length === 0 ? (
        <EmptyState title={search ? "No store matches" : "No stores yet"}>
          {search
            ? `Nothing matches “${search}”.`
            : scoped
              ? "No store has been shared with you in this company yet."
              : "This company has no stores on record yet."}
        </EmptyState>
      ) : null}
      {stores.data && stores.data.length > 0 ? (
        <DataTable<Store>
          caption="Stores"
          rows={stores.data}
          rowKey={(s) => s.id}
          columns={[
            {
              header: "Store",
              cell: (s) => (
                <Link to={`/stores/${s.id}`} className="inline-flex min-h-11 items-center font-bold">
                  {s.name}
                </Link>
              ),
            },
            { header: "Address", cell: (s) => <span className="whitespace-pre-line">{s.address || "—"}</span> },
            { header: "Time zone", cell: (s) => s.timeZone },
            { header: "Added", cell: (s) => formatDateInZone(s.createdAt, s.timeZone) },
            {
              header: "Status",
              cell: (s) => (s.archivedAt ? <span className="font-bold text-note">Archived</span> : "Active"),
            },
          ]}
        />
      ) : null}
    </div>
  );
}
