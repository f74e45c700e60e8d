/** Who is on the board (an initials disc per person, in their presence colour) and the connection state. */
import { initialsOf } from '../../../lib/format';
import type { Peer, PresenceUser } from '../session/awareness';
import type { ConnectionStatus } from '../session/use-board-session';

const STATUS: Record<ConnectionStatus, { text: string; dot: string; hint: string }> = {
  connecting: { text: 'connecting', dot: 'bg-slate-400', hint: 'Opening the live board…' },
  live: { text: 'live', dot: 'bg-emerald-400', hint: 'Edits are shared as you make them' },
  reconnecting: { text: 'reconnecting', dot: 'bg-amber-400 animate-pulse', hint: 'Connection lost; your edits are kept and sent when it is back' },
  offline: { text: 'offline', dot: 'bg-rose-500', hint: 'You are offline; your edits are kept and sent when you reconnect' },
  refused: { text: 'stopped', dot: 'bg-rose-500', hint: 'The server stopped this live session' },
};

function Disc({ user, you, away }: { user: PresenceUser; you?: boolean; away?: boolean }) {
  return (
    <span title={you ? `${user.name} (you)` : away ? `${user.name} (not connected)` : user.name} data-testid="presence-avatar"
      data-user={user.id} data-color={user.color} data-away={away ? 'true' : undefined}
      className={`inline-flex h-7 w-7 select-none items-center justify-center rounded-full font-mono text-[10px] font-semibold text-mat-950 ring-2 ring-mat-900 ${away ? 'opacity-40 grayscale' : ''}`}
      style={{ background: user.color }}>
      {initialsOf(user.name)}
    </span>
  );
}

export function PresenceBar({ me, peers, status, refusal }: { me: PresenceUser; peers: Peer[]; status: ConnectionStatus; refusal?: string | null }) {
  // One disc per person even when they have the board open in two tabs; away only when every tab is.
  // While this tab is not live, nobody can be seen: every other disc is greyed.
  const people = new Map<string, { user: PresenceUser; away: boolean }>();
  for (const p of peers) {
    if (p.user.id === me.id) continue;
    const away = status !== 'live' || p.away;
    const had = people.get(p.user.id);
    people.set(p.user.id, { user: p.user, away: had ? had.away && away : away });
  }
  const list = [...people.values()];
  const s = STATUS[status];
  return (
    <div className="flex items-center gap-3" data-testid="presence-bar">
      <div className="flex -space-x-1.5">
        <Disc user={me} you />
        {list.slice(0, 8).map((p) => <Disc key={p.user.id} user={p.user} away={p.away} />)}
        {list.length > 8 && <span className="ml-2 text-xs text-slate-400">+{list.length - 8}</span>}
      </div>
      <span className="flex items-center gap-1.5 text-xs text-slate-300" title={s.hint} data-testid="connection-status" data-status={status}>
        <span className={`h-2 w-2 rounded-full ${s.dot}`} />{s.text}
      </span>
      {status === 'refused' && refusal && (
        <span role="alert" className="max-w-md text-xs text-rose-300" data-testid="connection-refusal">{refusal}</span>
      )}
    </div>
  );
}
