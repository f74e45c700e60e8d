import { flexRender, type Table } from '@tanstack/react-table';
import { cn } from '../../lib/cn';

/**
 * Renders a TanStack Table v8 instance (made with `useReactTable` by the feature) in our look;
 * sortable headers toggle on click. Features own their columns; this owns the markup.
 */
export function DataTable<T>({ table, caption, rowTestId }: { table: Table<T>; caption: string; rowTestId?: string }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-mat-700">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-mat-800/80 text-xs uppercase tracking-wide text-slate-400">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sortable = header.column.getCanSort();
                const dir = header.column.getIsSorted();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : undefined}
                    className="px-4 py-2.5 font-medium"
                  >
                    {header.isPlaceholder ? null : sortable ? (
                      <button type="button" onClick={header.column.getToggleSortingHandler()} className="inline-flex items-center gap-1 uppercase hover:text-slate-200">
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden="true" className="font-mono text-amber-glow">
                          {dir === 'asc' ? '↑' : dir === 'desc' ? '↓' : ''}
                        </span>
                      </button>
                    ) : (
                      flexRender(header.column.columnDef.header, header.getContext())
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody className="divide-y divide-mat-700/70">
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} data-testid={rowTestId} className={cn('bg-mat-900/60 hover:bg-mat-800/60')}>
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="px-4 py-2.5 align-middle text-slate-200">
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
