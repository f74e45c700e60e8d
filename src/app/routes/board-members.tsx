import { useQuery } from '@tanstack/react-query';
import { Suspense } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { Card, CardBody, CardHeader } from '../../components/ui/card';
import { ErrorState } from '../../components/ui/error-state';
import { LoadingState } from '../../components/ui/spinner';
import { meQueryOptions } from '../../features/auth';
import { boardQueryOptions } from '../../features/boards';
import { membersQueryOptions, AddMemberForm, InvitationsList, MembersTable } from '../../features/members';
import { useIdParam } from '../../lib/use-id-param';
import { PageColumn } from '../layout';
import { PageTitle } from '../../components/ui/page-title';

export function BoardMembersPage() {
  const boardId = useIdParam() ?? 0;
  const board = useQuery({ ...boardQueryOptions(boardId), enabled: boardId > 0 });
  const members = useQuery({ ...membersQueryOptions(boardId), enabled: boardId > 0 });
  const me = useQuery(meQueryOptions);
  const navigate = useNavigate();

  if (boardId === 0) return <PageColumn><ErrorState error={new Error('A board address ends in its number, like /boards/12/members.')} title="Not a board address" /></PageColumn>;
  if (board.isPending || members.isPending || me.isPending) return <LoadingState label="Loading members…" />;
  const failed = board.error ?? members.error;
  if (failed)
    return (
      <PageColumn>
        <ErrorState error={failed} onRetry={() => Promise.all([board.refetch(), members.refetch()])} />
      </PageColumn>
    );
  const b = board.data!;
  const owner = b.role === 'owner';

  return (
    <PageColumn>
      <PageTitle>{`Members of ${b.title}`}</PageTitle>
      <div className="flex flex-col gap-6">
        <div className="flex items-baseline justify-between gap-4">
          <h1 className="text-lg font-semibold text-slate-100">
            Members of <span className="text-amber-300">{b.title}</span>
          </h1>
          <Link to={`/boards/${b.id}`} className="text-sm text-amber-300 hover:underline">
            ← Back to the board
          </Link>
        </div>
        {owner ? (
          <Card>
            <CardHeader title="Add member" subtitle="People with an account join at once; others get an invitation by e-mail." />
            <CardBody>
              <AddMemberForm boardId={b.id} />
            </CardBody>
          </Card>
        ) : (
          <p className="text-sm text-slate-400">Only the board's owner adds members and changes roles.</p>
        )}
        {/* the table's code is a chunk of its own */}
        <Suspense fallback={<LoadingState />}>
        <MembersTable
          boardId={b.id}
          members={members.data!.members}
          myRole={b.role}
          myUserId={me.data?.id ?? 0}
          onLeft={() => navigate('/boards', { replace: true })}
        />
        </Suspense>
        {owner && (
          <section aria-labelledby="pending-heading" className="flex flex-col gap-3">
            <h2 id="pending-heading" className="text-sm font-semibold uppercase tracking-wide text-slate-400">
              Pending invitations
            </h2>
            <InvitationsList boardId={b.id} invitations={members.data!.invitations} />
          </section>
        )}
      </div>
    </PageColumn>
  );
}
