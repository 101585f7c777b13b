/**
 * The DataTable's columns as TanStack Table (v9) sees them: one column per shown column, its value
 * the text the search box looks in, sorted by its own sort value and filtered by its own filter
 * value, so what a cell shows (React nodes) never has to be searchable or comparable itself.
 */
import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createSortedRowModel,
  globalFilteringFeature,
  rowSortingFeature,
  tableFeatures,
  type Row,
  type RowData,
} from "@tanstack/react-table";
import type { ReactNode } from "react";

export interface Column<Row> {
  header: string;
  cell: (row: Row) => ReactNode;
  className?: string;
  /** The value this column sorts by; its header becomes a sort button. */
  sortValue?: (row: Row) => string | number | null;
  /** The text the search box finds a row by. */
  searchText?: (row: Row) => string;
  /** The value this column filters by: a choice of the values present is offered above the table. */
  filterValue?: (row: Row) => string;
}

export const features = tableFeatures({
  columnFilteringFeature,
  globalFilteringFeature,
  rowSortingFeature,
  filteredRowModel: createFilteredRowModel(),
  sortedRowModel: createSortedRowModel(),
});

/** Stable ids from headers; an empty header (an actions column) gets its position. */
export function columnId(column: { header: string }, index: number): string {
  return column.header.trim() ? column.header : `column-${index}`;
}

/** Numbers before text, numbers by value, text by the reader's collation with numbers inside it in order. */
export function compareValues(a: string | number | null, b: string | number | null): number {
  if (a === b) return 0;
  if (a === null || a === "") return 1;
  if (b === null || b === "") return -1;
  if (typeof a === "number" && typeof b === "number") return a - b;
  if (typeof a === "number") return -1;
  if (typeof b === "number") return 1;
  return a.localeCompare(b, undefined, { numeric: true, sensitivity: "base" });
}

/** Case- and accent-insensitive "contains", for the search box. */
export function textMatches(text: string, query: string): boolean {
  const fold = (s: string) => s.normalize("NFKD").replace(/\p{M}/gu, "").toLowerCase();
  const q = fold(query.trim());
  return q === "" || fold(text).includes(q);
}

export function tableColumns<R extends RowData>(columns: readonly Column<R>[]) {
  const helper = createColumnHelper<typeof features, R>();
  return helper.columns(
    columns.map((c, i) =>
      helper.accessor((row: R) => c.searchText?.(row) ?? "", {
        id: columnId(c, i),
        header: c.header,
        enableSorting: Boolean(c.sortValue),
        enableGlobalFilter: Boolean(c.searchText),
        enableColumnFilter: Boolean(c.filterValue),
        sortFn: (a: Row<typeof features, R>, b: Row<typeof features, R>) =>
          compareValues(c.sortValue?.(a.original) ?? null, c.sortValue?.(b.original) ?? null),
        filterFn: (row: Row<typeof features, R>, _id: string, value: unknown) =>
          value === undefined || value === "" || c.filterValue?.(row.original) === value,
      }),
    ),
  );
}

/** The distinct filter values present in the rows, in order, for a column's choice list. */
export function filterChoices<R>(column: Column<R>, rows: readonly R[]): string[] {
  if (!column.filterValue) return [];
  return [...new Set(rows.map((r) => column.filterValue!(r)))].sort((a, b) => compareValues(a, b));
}
