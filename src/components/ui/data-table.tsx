import type { ReactNode } from 'react';

import { cn } from '@/utils/cn';

export type DataTableColumn<Row> = {
  header: string;
  cell: (row: Row) => ReactNode;
  /** This column names the row, so it is announced as the row's header. */
  isRowHeader?: boolean;
  className?: string;
};

type DataTableProps<Row> = {
  caption: string;
  columns: readonly DataTableColumn<Row>[];
  rows: readonly Row[];
  rowKey: (row: Row) => string;
  emptyMessage: string;
  dense?: boolean;
};

export function DataTable<Row>({
  caption,
  columns,
  rows,
  rowKey,
  emptyMessage,
  dense = false,
}: DataTableProps<Row>) {
  if (rows.length === 0) {
    return <p className="px-4 py-4 text-ink-muted md:px-5">{emptyMessage}</p>;
  }

  const cellPadding = dense ? 'px-3 py-1.5 md:px-4' : 'px-4 py-2.5 md:px-5';
  return (
    // Focusable so keyboard users can scroll a table wider than a narrow screen.
    <div role="region" aria-label={caption} tabIndex={0} className="overflow-x-auto">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-paper-deep">
          <tr>
            {columns.map((column) => (
              <th
                key={column.header}
                scope="col"
                className={cn(cellPadding, 'font-semibold whitespace-nowrap', column.className)}
              >
                {column.header}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-hairline">
          {rows.map((row) => (
            <tr key={rowKey(row)} className="align-top">
              {columns.map((column) =>
                column.isRowHeader ? (
                  <th
                    key={column.header}
                    scope="row"
                    className={cn(cellPadding, 'font-medium', column.className)}
                  >
                    {column.cell(row)}
                  </th>
                ) : (
                  <td key={column.header} className={cn(cellPadding, column.className)}>
                    {column.cell(row)}
                  </td>
                ),
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
