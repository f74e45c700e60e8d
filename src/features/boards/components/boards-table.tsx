import { createColumnHelper, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { ApiBoard } from '../../../../shared/api';
import { RoleBadge } from '../../../components/ui/role-badge';
import { DataTable } from '../../../components/ui/table';
import { FAMILY_LABELS } from '../../../lib/families';
import { formatDateTime } from '../../../lib/format';

const col = createColumnHelper<ApiBoard>();

const columns = [
  col.accessor('title', {
    header: 'Title',
    cell: (c) => (
      <Link to={`/boards/${c.row.original.id}`} className="font-medium text-slate-100 hover:text-amber-300 hover:underline">
        {c.getValue()}
      </Link>
    ),
  }),
  col.accessor('family', { header: 'Family', cell: (c) => <span className="text-slate-400">{FAMILY_LABELS[c.getValue()] ?? c.getValue()}</span> }),
  col.accessor('role', { header: 'Your role', cell: (c) => <RoleBadge role={c.getValue()} /> }),
  col.accessor('memberCount', { header: 'Members', cell: (c) => <span className="font-mono">{c.getValue()}</span> }),
  col.accessor('updatedAt', {
    header: 'Updated',
    cell: (c) => <span className="whitespace-nowrap font-mono text-xs text-slate-400">{formatDateTime(c.getValue())}</span>,
  }),
];

/** Your boards, most recently changed first; every column sorts. */
export function BoardsTable({ boards }: { boards: ApiBoard[] }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'updatedAt', desc: true }]);
  const table = useReactTable({
    data: boards,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getRowId: (b) => String(b.id),
  });
  return <DataTable table={table} caption="Your boards" rowTestId="board-row" />;
}
