import { useEffect, useRef } from 'react';
import { Link } from 'react-router-dom';
import type { ApiInvitationInfo, ApiUser } from '../../../../shared/api';
import { Button } from '../../../components/ui/button';
import { Card, CardBody } from '../../../components/ui/card';
import { RoleBadge } from '../../../components/ui/role-badge';
import { notifyError, notifySuccess } from '../../../lib/notify';
import { signInPath } from '../../../lib/safe-next';
import { useAcceptInvitation } from '../api';

interface Props {
  token: string;
  invitation: ApiInvitationInfo;
  user: ApiUser | null;
  onAccepted: (boardId: number) => void;
  /** accept at once when signed in (the account was just created from this invitation) */
  autoAccept?: boolean;
}

/** Who invited you to which board, and the way in: sign in or up first, then accept. */
export function InvitationCard({ token, invitation, user, onAccepted, autoAccept = false }: Props) {
  const accept = useAcceptInvitation(token);
  const here = `/invitations/${encodeURIComponent(token)}`;
  const otherAddress = user && user.email.toLowerCase() !== invitation.email.toLowerCase();
  const doAccept = () =>
    accept.mutate(undefined, {
      onSuccess: (board) => {
        notifySuccess(`You joined “${board.title}”`);
        onAccepted(board.id);
      },
      onError: (err) => notifyError(err, 'Could not accept the invitation'),
    });
  // Someone who created their account from this invitation came to join: no second click (once only).
  const autoStarted = useRef(false);
  useEffect(() => {
    if (!autoAccept || !user || otherAddress || autoStarted.current) return;
    autoStarted.current = true;
    doAccept();
  });

  return (
    <Card>
      <CardBody className="flex flex-col gap-4 px-6 py-6">
        <div>
          <p className="text-sm text-slate-400">
            <span className="text-slate-200">{invitation.invitedBy}</span> invited{' '}
            <span className="font-mono text-slate-200">{invitation.email}</span> to the board
          </p>
          <h1 className="mt-1 text-xl font-semibold text-slate-100" data-testid="invitation-board">
            {invitation.boardTitle}
          </h1>
          <p className="mt-2 flex items-center gap-2 text-sm text-slate-400">
            as <RoleBadge role={invitation.role} />
          </p>
        </div>
        {user ? (
          <>
            <p className="text-sm text-slate-400">
              Signed in as <span className="text-slate-200">{user.name}</span> (<span className="font-mono">{user.email}</span>).
              {otherAddress && ' This invitation was sent to another address; accepting adds this account.'}
            </p>
            <Button
              variant="primary"
              busy={accept.isPending}
              onClick={doAccept}
            >
              Accept invitation
            </Button>
          </>
        ) : (
          <div className="flex flex-col gap-3">
            <p className="text-sm text-slate-400">Sign in, or create an account, to accept. You will come back here (a new account joins the board at once).</p>
            <div className="flex flex-wrap gap-2">
              <Link to={`${signInPath(`${here}?accept=1`, '/signup')}&email=${encodeURIComponent(invitation.email)}`} className="inline-flex h-9 items-center rounded-md bg-amber-glow px-4 text-sm font-semibold text-mat-950 hover:bg-amber-300">
                Create an account
              </Link>
              <Link to={signInPath(here)} className="inline-flex h-9 items-center rounded-md border border-mat-600 bg-mat-800 px-4 text-sm text-slate-100 hover:bg-mat-700">
                Sign in
              </Link>
            </div>
          </div>
        )}
      </CardBody>
    </Card>
  );
}
