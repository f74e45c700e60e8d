import type { ApiInvitation } from '../../../../shared/api';
import { ConfirmButton } from '../../../components/ui/confirm-button';
import { RoleBadge } from '../../../components/ui/role-badge';
import { formatDateTime } from '../../../lib/format';
import { notifyError, notifySuccess } from '../../../lib/notify';
import { useRevokeInvitation } from '../api';

/** Addresses invited but not yet signed up and accepted (the server lists them to owners only), each revocable. */
export function InvitationsList({ boardId, invitations }: { boardId: number; invitations: ApiInvitation[] }) {
  const revoke = useRevokeInvitation(boardId);
  if (invitations.length === 0) return <p className="text-sm text-slate-500">No pending invitations.</p>;
  return (
    <ul className="divide-y divide-mat-700/70 rounded-lg border border-mat-700" data-testid="invitation-list">
      {invitations.map((inv) => (
        <li key={inv.id} className="flex flex-wrap items-center gap-3 bg-mat-900/60 px-4 py-2.5 text-sm">
          <span className="font-mono text-slate-200">{inv.email}</span>
          <RoleBadge role={inv.role} />
          <span className="ml-auto text-xs text-slate-500">invited {formatDateTime(inv.createdAt)}</span>
          <ConfirmButton
            size="sm"
            variant="ghost"
            busy={revoke.isPending && revoke.variables === inv.id}
            title={`Revoke the invitation to ${inv.email}?`}
            description="The link in the e-mail stops working. You can invite the address again later."
            confirmLabel="Revoke invitation"
            aria-label={`Revoke the invitation to ${inv.email}`}
            onConfirm={() => revoke.mutate(inv.id, {
              onSuccess: () => notifySuccess(`Invitation to ${inv.email} revoked`),
              onError: (err) => notifyError(err, 'Could not revoke the invitation'),
            })}
          >
            Revoke
          </ConfirmButton>
        </li>
      ))}
    </ul>
  );
}
