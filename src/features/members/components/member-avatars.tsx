import { useQuery } from '@tanstack/react-query';
import { Avatar } from '../../../components/ui/avatar';
import { Spinner } from '../../../components/ui/spinner';
import { membersQueryOptions } from '../api';

const SHOWN = 5;

/** A compact row of the board's members for the header: initials discs, names on hover. */
export function MemberAvatars({ boardId }: { boardId: number }) {
  const members = useQuery(membersQueryOptions(boardId));
  if (members.isPending) return <Spinner size="sm" label="Loading members" className="text-slate-500" />;
  if (members.isError) return <span className="text-xs text-rose-300">Members unavailable</span>;
  const list = members.data.members;
  const names = list.map((m) => `${m.name} (${m.role})`).join(', ');
  return (
    <div className="flex items-center" aria-label={`Members: ${names}`} title={names} data-testid="member-avatars">
      {list.slice(0, SHOWN).map((m, i) => (
        <Avatar key={m.userId} name={m.name} userId={m.userId} size="sm" className={i > 0 ? '-ml-1.5' : undefined} />
      ))}
      {list.length > SHOWN && <span className="ml-1.5 font-mono text-xs text-slate-400">+{list.length - SHOWN}</span>}
    </div>
  );
}
