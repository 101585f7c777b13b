import { useId, useMemo, useState, type ReactNode } from "react";
import { useTable, type ColumnFiltersState, type RowData, type SortingState } from "@tanstack/react-table";
import { columnId, features, filterChoices, tableColumns, textMatches, type Column } from "./data-table-model";

export type { Column } from "./data-table-model";

export interface DataTableProps<Row extends RowData> {
  caption: string;
  columns: readonly Column<Row>[];
  rows: readonly Row[];
  rowKey: (row: Row) => string;
  /** An extra full-width row under a row (an inline editor or a confirm), or null. */
  rowDetail?: (row: Row) => ReactNode;
  /** The search box's label ("Search systems"); no box without it. Columns with `searchText` are searched. */
  search?: string;
  /** The order the rows start in, by a column's header. */
  initialSort?: { header: string; desc?: boolean };
}

const INPUT = "mt-1 block min-h-11 w-full rounded-md bg-surface px-3 py-2 text-ink edge";

/**
 * A table that can be searched, filtered and sorted (TanStack Table), laid out as a table from a
 * tablet's width up and as one card per row on a phone, so nothing scrolls sideways: each cell then
 * shows its column's name beside it. Sorting is a header button on wide screens and a choice above
 * the cards on a phone.
 */
export function DataTable<Row extends RowData>({
  caption,
  columns,
  rows,
  rowKey,
  rowDetail,
  search,
  initialSort,
}: DataTableProps<Row>) {
  const id = useId();
  const defs = useMemo(() => tableColumns(columns), [columns]);
  const data = useMemo(() => [...rows], [rows]);
  const [sorting, setSorting] = useState<SortingState>(() => {
    const i = initialSort ? columns.findIndex((c) => c.header === initialSort.header) : -1;
    return i >= 0 ? [{ id: columnId(columns[i], i), desc: initialSort?.desc ?? false }] : [];
  });
  const [globalFilter, setGlobalFilter] = useState("");
  const [columnFilters, setColumnFilters] = useState<ColumnFiltersState>([]);
  const table = useTable({
    features,
    columns: defs,
    data,
    getRowId: (row: Row) => rowKey(row),
    state: { sorting, globalFilter, columnFilters },
    onSortingChange: setSorting,
    onGlobalFilterChange: setGlobalFilter,
    onColumnFiltersChange: setColumnFilters,
    globalFilterFn: (row, colId, query) => textMatches(String(row.getValue(colId) ?? ""), String(query ?? "")),
  });
  const shown = table.getRowModel().rows;
  const sortable = columns.map((c, i) => ({ c, id: columnId(c, i) })).filter(({ c }) => c.sortValue);
  const filterable = columns.map((c, i) => ({ c, id: columnId(c, i) })).filter(({ c }) => c.filterValue);
  const narrowed = shown.length !== rows.length;
  const filterOf = (colId: string) => String(columnFilters.find((f) => f.id === colId)?.value ?? "");
  const setFilter = (colId: string, value: string) =>
    setColumnFilters((old) => [...old.filter((f) => f.id !== colId), ...(value ? [{ id: colId, value }] : [])]);
  const sortKey = sorting[0] ? `${sorting[0].id}:${sorting[0].desc ? "desc" : "asc"}` : "";

  return (
    <div className="space-y-2">
      {search || filterable.length || sortable.length ? (
        <div className="flex flex-wrap items-end gap-3" role="group" aria-label={`${caption}: search, filter and sort`}>
          {search ? (
            <div className="min-w-48 flex-1">
              <label htmlFor={`${id}-search`} className="block font-bold">
                {search}
              </label>
              <input
                id={`${id}-search`}
                type="search"
                className={INPUT}
                value={globalFilter}
                onChange={(e) => setGlobalFilter(e.currentTarget.value)}
              />
            </div>
          ) : null}
          {filterable.map(({ c, id: colId }) => (
            <div key={colId} className="min-w-40">
              <label htmlFor={`${id}-filter-${colId}`} className="block font-bold">
                {c.header}
                <span className="sr-only"> ({caption})</span>
              </label>
              <select
                id={`${id}-filter-${colId}`}
                className={INPUT}
                value={filterOf(colId)}
                onChange={(e) => setFilter(colId, e.currentTarget.value)}
              >
                <option value="">All</option>
                {filterChoices(c, rows).map((v) => (
                  <option key={v} value={v}>
                    {v}
                  </option>
                ))}
              </select>
            </div>
          ))}
          {sortable.length ? (
            <div className="min-w-40 md:hidden">
              <label htmlFor={`${id}-sort`} className="block font-bold">
                Sort by<span className="sr-only"> ({caption})</span>
              </label>
              <select
                id={`${id}-sort`}
                className={INPUT}
                value={sortKey}
                onChange={(e) => {
                  const [colId, dir] = e.currentTarget.value.split(":");
                  setSorting(colId ? [{ id: colId, desc: dir === "desc" }] : []);
                }}
              >
                <option value="">As listed</option>
                {sortable.flatMap(({ c, id: colId }) => [
                  <option key={`${colId}:asc`} value={`${colId}:asc`}>
                    {c.header}, ascending
                  </option>,
                  <option key={`${colId}:desc`} value={`${colId}:desc`}>
                    {c.header}, descending
                  </option>,
                ])}
              </select>
            </div>
          ) : null}
        </div>
      ) : null}
      {narrowed ? (
        <p className="text-sm text-muted" aria-live="polite">
          Showing {shown.length} of {rows.length}.
        </p>
      ) : null}
      {/* A scrolling region must be reachable by keyboard to be scrolled (WCAG 2.1.1). On a phone the rows are
          cards and the header row is for screen readers only: the box holds it (relative, overflow hidden), or its
          full-width row would widen the page and a phone browser would zoom out to show it. */}
      <div
        className="rounded-md bg-surface edge max-md:relative max-md:overflow-hidden md:overflow-x-auto"
        role="region"
        aria-label={caption}
        tabIndex={0}
      >
        <table className="w-full border-collapse text-left max-md:block" role="table">
          <caption className="sr-only">{caption}</caption>
          <thead className="max-md:sr-only">
            <tr className="bg-accent-soft">
              {table.getHeaderGroups()[0].headers.map((header, i) => {
                const c = columns[i];
                const sorted = header.column.getIsSorted();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted ? (sorted === "asc" ? "ascending" : "descending") : undefined}
                    className={`px-3 py-2 font-bold ${c.className ?? ""}`}
                  >
                    {c.sortValue ? (
                      <button
                        type="button"
                        className="inline-flex min-h-11 items-center gap-1 font-bold underline-offset-2 hover:underline"
                        onClick={header.column.getToggleSortingHandler()}
                      >
                        {c.header}
                        <span aria-hidden="true">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                      </button>
                    ) : (
                      c.header
                    )}
                  </th>
                );
              })}
            </tr>
          </thead>
          <tbody className="max-md:block">
            {shown.map((row) => {
              const detail = rowDetail?.(row.original);
              return (
                <RowGroup key={row.id}>
                  <tr className="border-t border-line align-top max-md:block max-md:px-3 max-md:py-2" role="row">
                    {columns.map((c, i) => (
                      <td
                        key={columnId(c, i)}
                        role="cell"
                        data-label={c.header || undefined}
                        className={`px-3 py-2 max-md:flex max-md:gap-3 max-md:px-0 max-md:py-1 ${c.header ? "max-md:before:w-32 max-md:before:shrink-0 max-md:before:font-bold max-md:before:text-muted max-md:before:content-[attr(data-label)]" : ""} ${c.className ?? ""}`}
                      >
                        <div className="min-w-0 break-words">{c.cell(row.original)}</div>
                      </td>
                    ))}
                  </tr>
                  {detail ? (
                    <tr className="max-md:block" role="row">
                      <td colSpan={columns.length} className="px-3 pb-3 max-md:block" role="cell">
                        {detail}
                      </td>
                    </tr>
                  ) : null}
                </RowGroup>
              );
            })}
            {shown.length === 0 ? (
              <tr className="max-md:block" role="row">
                <td colSpan={columns.length} className="px-3 py-3 text-muted max-md:block" role="cell">
                  Nothing matches{globalFilter ? ` “${globalFilter}”` : " these filters"}.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}

function RowGroup({ children }: { children: ReactNode }) {
  return <>{children}</>;
}
