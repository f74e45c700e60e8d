/** Who is on the board (an initials disc per person, in their presence colour) and the connection state. */
import { initialsOf } from '../../../lib/format';
import type { Peer, PresenceUser } from '../session/awareness';
import type { ConnectionStatus } from '../session/use-board-session';

const STATUS: Record<ConnectionStatus, { text: string; dot: string; hint: string }> = {
  connecting: { text: 'connecting', dot: 'bg-slate-400', hint: 'Opening the live board…' },
  live: { text: 'live', dot: 'bg-emerald-400', hint: 'Edits are shared as you make them' },
  reconnecting: { text: 'reconnecting', dot: 'bg-amber-400 animate-pulse', hint: 'Connection lost; your edits are kept and sent when it is back' },
  offline: { text: 'offline', dot: 'bg-rose-500', hint: 'You are offline; your edits are kept and sent when you reconnect' },
};

function Disc({ user, you }: { user: PresenceUser; you?: boolean }) {
  return (
    <span title={you ? `${user.name} (you)` : user.name} data-testid="presence-avatar"
      className="inline-flex h-7 w-7 select-none items-center justify-center rounded-full font-mono text-[10px] font-semibold text-mat-950 ring-2 ring-mat-900"
      style={{ background: user.color }}>
      {initialsOf(user.name)}
    </span>
  );
}

export function PresenceBar({ me, peers, status }: { me: PresenceUser; peers: Peer[]; status: ConnectionStatus }) {
  // One disc per person even when they have the board open in two tabs.
  const people = [...new Map(peers.filter((p) => p.user.id !== me.id).map((p) => [p.user.id, p.user])).values()];
  const s = STATUS[status];
  return (
    <div className="flex items-center gap-3" data-testid="presence-bar">
      <div className="flex -space-x-1.5">
        <Disc user={me} you />
        {people.slice(0, 8).map((u) => <Disc key={u.id} user={u} />)}
        {people.length > 8 && <span className="ml-2 text-xs text-slate-400">+{people.length - 8}</span>}
      </div>
      <span className="flex items-center gap-1.5 text-xs text-slate-300" title={s.hint} data-testid="connection-status" data-status={status}>
        <span className={`h-2 w-2 rounded-full ${s.dot}`} />{s.text}
      </span>
    </div>
  );
}
