'use client';

import { flexRender, type Row, type Table } from '@tanstack/react-table';

/**
 * Renders a TanStack table: hairline rows, sortable headers as buttons with `aria-sort`, and an optional
 * test id per row. The table instance (columns, sorting state) belongs to the caller.
 */
export function DataTable<T>({ table, testId, rowTestId, dense = false }: { table: Table<T>; testId?: string; rowTestId?: (row: Row<T>) => string; dense?: boolean }) {
  return (
    <table className="w-full border-collapse text-sm" data-testid={testId}>
      <thead>
        {table.getHeaderGroups().map((hg) => (
          <tr key={hg.id} className="border-b-[0.5px] border-rule-strong text-left">
            {hg.headers.map((h) => {
              const sorted = h.column.getIsSorted();
              return (
                <th key={h.id} scope="col" aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined} className="py-2 pr-4 font-medium text-graphite-soft">
                  {h.column.getCanSort() ? (
                    <button type="button" onClick={h.column.getToggleSortingHandler()} className="hover:text-graphite">
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      <span aria-hidden="true" className="ml-1 text-xs">
                        {sorted === 'asc' ? '↑' : sorted === 'desc' ? '↓' : ''}
                      </span>
                    </button>
                  ) : (
                    flexRender(h.column.columnDef.header, h.getContext())
                  )}
                </th>
              );
            })}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => (
          <tr key={row.id} className="border-b-[0.5px] border-rule" data-testid={rowTestId?.(row)}>
            {row.getVisibleCells().map((cell) => (
              <td key={cell.id} className={`${dense ? 'py-1.5' : 'py-2'} pr-4 align-middle`}>
                {flexRender(cell.column.columnDef.cell, cell.getContext())}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
