import { createColumnHelper, getCoreRowModel, getSortedRowModel, useReactTable } from '@tanstack/react-table';
import { useMemo } from 'react';
import type { ApiMember, BoardRole } from '../../../../shared/api';
import { MemberRoleSchema } from '../../../../shared/api';
import { Avatar } from '../../../components/ui/avatar';
import { ConfirmButton } from '../../../components/ui/confirm-button';
import { RoleBadge } from '../../../components/ui/role-badge';
import { DataTable } from '../../../components/ui/table';
import { notifyError, notifySuccess } from '../../../lib/notify';
import { useRemoveMember, useUpdateMemberRole } from '../api';
import { ROLE_OPTIONS } from './role-options';

const col = createColumnHelper<ApiMember>();

interface Props {
  boardId: number;
  members: ApiMember[];
  myRole: BoardRole;
  myUserId: number;
  /** Called after I removed myself (I can no longer see the board). */
  onLeft: () => void;
}

/** The board's members. Owners change roles and remove people; anyone may leave. */
export function MembersTable({ boardId, members, myRole, myUserId, onLeft }: Props) {
  const updateRole = useUpdateMemberRole(boardId);
  const remove = useRemoveMember(boardId);
  const owner = myRole === 'owner';

  const columns = useMemo(
    () => [
      col.accessor('name', {
        header: 'Name',
        cell: (c) => (
          <span className="flex items-center gap-2">
            <Avatar name={c.getValue()} userId={c.row.original.userId} size="sm" />
            <span>{c.getValue()}</span>
            {c.row.original.userId === myUserId && <span className="text-xs text-slate-500">(you)</span>}
          </span>
        ),
      }),
      // owners only: others are not given members' addresses
      ...(owner ? [col.accessor('email', { header: 'E-mail', cell: (c) => <span className="font-mono text-xs text-slate-300">{c.getValue() ?? ''}</span> })] : []),
      col.accessor('role', {
        header: 'Role',
        cell: (c) => {
          const m = c.row.original;
          if (!owner || m.role === 'owner') return <RoleBadge role={m.role} />;
          return (
            <select
              aria-label={`Role of ${m.name}`}
              value={m.role}
              disabled={updateRole.isPending}
              onChange={(e) => {
                const role = MemberRoleSchema.safeParse(e.target.value);
                if (!role.success) return;
                updateRole.mutate(
                  { userId: m.userId, role: role.data },
                  { onSuccess: () => notifySuccess(`${m.name} is now ${role.data}`), onError: (err) => notifyError(err, 'Could not change the role') },
                );
              }}
              className="h-7 rounded border border-mat-600 bg-mat-950 px-2 text-xs text-slate-200 focus:border-amber-glow focus:outline-none"
            >
              {ROLE_OPTIONS.map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </select>
          );
        },
      }),
      col.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: (c) => {
          const m = c.row.original;
          const self = m.userId === myUserId;
          if (m.role === 'owner' || (!owner && !self)) return null;
          return (
            <ConfirmButton
              size="sm"
              title={self ? 'Leave this board?' : `Remove ${m.name}?`}
              description={self ? 'You will lose access until an owner adds you again.' : `${m.name} will no longer see or edit the board.`}
              confirmLabel={self ? 'Leave' : 'Remove'}
              onConfirm={() =>
                remove.mutate(m.userId, {
                  onSuccess: () => {
                    notifySuccess(self ? 'You left the board' : `${m.name} removed`);
                    if (self) onLeft();
                  },
                  onError: (err) => notifyError(err, 'Could not remove the member'),
                })
              }
            >
              {self ? 'Leave' : 'Remove'}
            </ConfirmButton>
          );
        },
      }),
    ],
    [owner, myUserId, updateRole, remove, onLeft],
  );

  const table = useReactTable({
    data: members,
    columns,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getRowId: (m) => String(m.userId),
  });
  return <DataTable table={table} caption="Board members" rowTestId="member-row" />;
}
