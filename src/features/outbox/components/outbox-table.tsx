import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import type { ApiMailSummary } from '../../../../shared/api';
import { DataTable } from '../../../components/ui/table';
import { formatDateTime } from '../../../lib/format';

const col = createColumnHelper<ApiMailSummary>();

const columns = [
  col.accessor('to', { header: 'To', cell: (c) => <span className="font-mono text-xs">{c.getValue()}</span> }),
  col.accessor('subject', {
    header: 'Subject',
    cell: (c) => (
      <Link to={`/outbox/${c.row.original.id}`} className="text-slate-100 hover:text-amber-300 hover:underline">
        {c.getValue() || '(no subject)'}
      </Link>
    ),
  }),
  col.accessor('date', { header: 'Date', cell: (c) => <span className="whitespace-nowrap font-mono text-xs text-slate-400">{formatDateTime(c.getValue())}</span> }),
];

/** Mail the server has sent, newest first (the server's order is kept). */
export function OutboxTable({ messages }: { messages: ApiMailSummary[] }) {
  const table = useReactTable({ data: messages, columns, getCoreRowModel: getCoreRowModel(), getRowId: (m) => String(m.id) });
  return <DataTable table={table} caption="Sent messages" rowTestId="outbox-row" />;
}
