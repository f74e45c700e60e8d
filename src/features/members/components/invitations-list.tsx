import type { ApiInvitation } from '../../../../shared/api';
import { RoleBadge } from '../../../components/ui/role-badge';
import { formatDateTime } from '../../../lib/format';

/** Addresses invited but not yet signed up and accepted (the server lists them to owners only). */
export function InvitationsList({ invitations }: { invitations: ApiInvitation[] }) {
  if (invitations.length === 0) return <p className="text-sm text-slate-500">No pending invitations.</p>;
  return (
    <ul className="divide-y divide-mat-700/70 rounded-lg border border-mat-700" data-testid="invitation-list">
      {invitations.map((inv) => (
        <li key={inv.id} className="flex flex-wrap items-center gap-3 bg-mat-900/60 px-4 py-2.5 text-sm">
          <span className="font-mono text-slate-200">{inv.email}</span>
          <RoleBadge role={inv.role} />
          <span className="ml-auto text-xs text-slate-500">invited {formatDateTime(inv.createdAt)}</span>
        </li>
      ))}
    </ul>
  );
}
