import { useQuery } from '@tanstack/react-query';
import { useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { ErrorState } from '../../components/ui/error-state';
import { LoadingState } from '../../components/ui/spinner';
import { meQueryOptions } from '../../features/auth';
import { invitationQueryOptions, InvitationCard } from '../../features/members';
import { isApiError } from '../../lib/api-client';
import { PageColumn } from '../layout';
import { PageTitle } from '../../components/ui/page-title';

export function InvitationAcceptPage() {
  const { token = '' } = useParams();
  // `?accept=1`: back from "Create an account" on this invitation, so join at once
  const [params] = useSearchParams();
  const invitation = useQuery(invitationQueryOptions(token));
  const me = useQuery(meQueryOptions);
  const navigate = useNavigate();

  let body;
  if (invitation.isPending || me.isPending) body = <LoadingState label="Reading the invitation…" />;
  else if (invitation.isError)
    body =
      isApiError(invitation.error) && invitation.error.status === 404 ? (
        <ErrorState
          error={invitation.error}
          title="Invitation not found"
          message="This invitation link is unknown or has already been used. Ask the board's owner to invite you again."
        />
      ) : (
        <ErrorState error={invitation.error} onRetry={() => invitation.refetch()} />
      );
  else if (me.isError) body = <ErrorState error={me.error} onRetry={() => me.refetch()} />;
  else body = <InvitationCard token={token} invitation={invitation.data} user={me.data} autoAccept={params.get('accept') === '1'}
    onAccepted={(id) => navigate(`/boards/${id}`, { replace: true })} />;

  return (
    <PageColumn width="narrow">
      <PageTitle>Invitation</PageTitle>
      {body}
    </PageColumn>
  );
}
