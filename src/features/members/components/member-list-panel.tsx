import { useQuery } from '@tanstack/react-query';
import { Avatar } from '../../../components/ui/avatar';
import { ErrorState } from '../../../components/ui/error-state';
import { RoleBadge } from '../../../components/ui/role-badge';
import { LoadingState } from '../../../components/ui/spinner';
import { membersQueryOptions } from '../api';

/** Who is on the board, with names and roles: a side panel of the board page. */
export function MemberListPanel({ boardId, currentUserId }: { boardId: number; currentUserId?: number }) {
  const members = useQuery(membersQueryOptions(boardId));
  return (
    <section aria-labelledby="member-list-heading" className="flex flex-col gap-3 rounded-lg border border-mat-700 bg-mat-900/85 p-4">
      <h2 id="member-list-heading" className="text-xs font-semibold uppercase tracking-wide text-slate-400">
        Members
      </h2>
      {members.isPending ? (
        <LoadingState label="Loading members…" />
      ) : members.isError ? (
        <ErrorState error={members.error} onRetry={() => members.refetch()} />
      ) : (
        <ul className="flex flex-col gap-2" data-testid="member-list">
          {members.data.members.map((m) => (
            <li key={m.userId} className="flex items-center gap-2.5">
              <Avatar name={m.name} userId={m.userId} />
              <div className="min-w-0 flex-1">
                <div className="truncate text-sm text-slate-100">
                  {m.name}
                  {m.userId === currentUserId && <span className="text-slate-500"> (you)</span>}
                </div>
                {/* the server gives e-mail addresses to the owner only */}
                {m.email && <div className="truncate font-mono text-[11px] text-slate-500">{m.email}</div>}
              </div>
              <RoleBadge role={m.role} />
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
