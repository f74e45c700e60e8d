import { useMemo, useRef } from 'react';
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef } from '@tanstack/react-table';
import { useVirtualizer } from '@tanstack/react-virtual';
import { CODE_CHARS } from '../../../shared/analysis';
import { cn } from '../../lib/cn';
import type { AnalysisResult } from './protocol';
import { plural } from '../../lib/plural';

// 16 px rows keep a million-row table (16.8 M px) under every browser's tallest element
const ROW_PX = 16;
const TONE: Record<string, string> = {
  '1': 'text-signal-high', '0': 'text-signal-low', X: 'text-signal-x', Z: 'text-signal-z', '-': 'text-slate-300',
};

/**
 * The truth table, virtualised: only the rows in view are rendered (a million-row table scrolls as
 * fast as a small one). The table model is built for the visible rows only. Clicking an output cell
 * marks that row don't-care for that output (–) or clears the mark.
 */
export function TruthTableView({ result, dontCares, onToggle }: {
  result: AnalysisResult;
  dontCares: Record<string, number[]>;
  onToggle(output: string, row: number): void;
}) {
  const scrollRef = useRef<HTMLDivElement>(null);
  const k = result.inputs.length;
  const marks = useMemo(() => Object.fromEntries(result.outputs.map((o) => [o, new Set(dontCares[o] ?? [])])), [result, dontCares]);
  const virtualizer = useVirtualizer({ count: result.rowCount, getScrollElement: () => scrollRef.current, estimateSize: () => ROW_PX, overscan: 16 });
  const items = virtualizer.getVirtualItems();
  const visible = items.map((i) => i.index);

  const columns = useMemo<ColumnDef<number>[]>(() => [
    ...result.inputs.map((name, i): ColumnDef<number> => ({
      id: `in:${name}`, header: name,
      cell: ({ row }) => <span className="text-slate-300">{(row.original >>> (k - 1 - i)) & 1}</span>,
    })),
    ...result.outputs.map((name, o): ColumnDef<number> => ({
      id: `out:${name}`, header: name,
      cell: ({ row }) => {
        const r = row.original;
        const ch = marks[name]?.has(r) ? '-' : CODE_CHARS[result.values[o][r]];
        return (
          <button type="button" onClick={() => onToggle(name, r)} data-testid={`tt-${name}-${r}`}
            title={ch === '-' ? 'don’t-care (click to use the value again)' : 'click to mark this row don’t-care for minimisation'}
            className={cn('w-full rounded px-1 leading-4 hover:bg-mat-700', TONE[ch])}>
            {ch === '-' ? '–' : ch}
          </button>
        );
      },
    })),
  ], [result, k, marks, onToggle]);

  // `visible` is a new array every render; with the default page-index auto-reset each render queued a
  // state update and the next render another, which froze the page while the bench re-rendered it often.
  const table = useReactTable({ data: visible, columns, getCoreRowModel: getCoreRowModel(), autoResetPageIndex: false });
  const rows = table.getRowModel().rows;
  const top = items[0]?.start ?? 0;
  const bottom = virtualizer.getTotalSize() - (items.at(-1)?.end ?? 0);

  return (
    <div ref={scrollRef} className="max-h-72 overflow-auto rounded border border-mat-700" data-testid="truth-table" aria-rowcount={result.rowCount + 1}>
      <table className="w-full border-collapse font-mono text-xs">
        <caption className="sr-only">Truth table, {plural(result.rowCount, 'row')}</caption>
        <thead className="sticky top-0 bg-mat-800">
          {table.getHeaderGroups().map((g) => (
            <tr key={g.id}>
              {g.headers.map((h, i) => (
                <th key={h.id} scope="col" className={cn('px-1.5 py-1 text-center font-medium', i === k - 1 && 'border-r border-mat-600', i >= k ? 'text-amber-300' : 'text-slate-300')}>
                  {flexRender(h.column.columnDef.header, h.getContext())}
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody>
          {top > 0 && <tr style={{ height: top }} aria-hidden="true" />}
          {rows.map((row) => (
            <tr key={row.original} style={{ height: ROW_PX }} className="odd:bg-mat-900/60" aria-rowindex={row.original + 2}>
              {row.getVisibleCells().map((cell, i) => (
                <td key={cell.id} className={cn('px-1.5 text-center leading-4', i === k - 1 && 'border-r border-mat-600')}>{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>
              ))}
            </tr>
          ))}
          {bottom > 0 && <tr style={{ height: bottom }} aria-hidden="true" />}
        </tbody>
      </table>
    </div>
  );
}
