import type { ReactNode } from "react";

export interface Column<Row> {
  header: string;
  cell: (row: Row) => ReactNode;
  className?: string;
}

export interface DataTableProps<Row> {
  caption: string;
  columns: readonly Column<Row>[];
  rows: readonly Row[];
  rowKey: (row: Row) => string;
  /** An extra full-width row under a row (an inline editor or a confirm), or null. */
  rowDetail?: (row: Row) => ReactNode;
}

/** A plain table that scrolls sideways on a phone instead of squeezing its columns. */
export function DataTable<Row>({ caption, columns, rows, rowKey, rowDetail }: DataTableProps<Row>) {
  return (
    // A scrolling region must be reachable by keyboard to be scrolled (WCAG 2.1.1).
    <div className="overflow-x-auto rounded-md bg-surface edge" role="region" aria-label={caption} tabIndex={0}>
      <table className="w-full min-w-max border-collapse text-left">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="bg-accent-soft">
            {columns.map((column) => (
              <th key={column.header} scope="col" className={`px-3 py-2 font-bold ${column.className ?? ""}`}>
                {column.header}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => {
            const detail = rowDetail?.(row);
            return (
              <RowGroup key={rowKey(row)}>
                <tr className="border-t border-line align-top">
                  {columns.map((column) => (
                    <td key={column.header} className={`px-3 py-2 ${column.className ?? ""}`}>
                      {column.cell(row)}
                    </td>
                  ))}
                </tr>
                {detail ? (
                  <tr>
                    <td colSpan={columns.length} className="px-3 pb-3">
                      {detail}
                    </td>
                  </tr>
                ) : null}
              </RowGroup>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

function RowGroup({ children }: { children: ReactNode }) {
  return <>{children}</>;
}
