import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import type { ApiNewShareLink } from '../../../../shared/api';
import { Button } from '../../../components/ui/button';
import { notifyError } from '../../../lib/notify';
import { plural } from '../../../lib/plural';
import { shareLinksQueryOptions, useCreateShareLink, useRevokeShareLink } from '../api';
import { LinkQr } from './link-qr';

const LIFETIMES = [
  { label: 'until revoked', minutes: undefined },
  { label: '2 hours', minutes: 120 },
  { label: '1 day', minutes: 24 * 60 },
  { label: '1 week', minutes: 7 * 24 * 60 },
] as const;

/**
 * Class mode for the owner: share links a class opens without accounts (the new link as text and as a
 * QR code — its token is shown only once), each link's audience, revoking, and the audience in the room.
 */
export function ClassPanel({ boardId, viewers }: { boardId: number; viewers: number }) {
  const links = useQuery(shareLinksQueryOptions(boardId));
  const create = useCreateShareLink(boardId);
  const revoke = useRevokeShareLink(boardId);
  const [fresh, setFresh] = useState<ApiNewShareLink | null>(null);
  const [lifetime, setLifetime] = useState(0);
  return (
    <section aria-label="Class" data-testid="class-panel" className="space-y-3 p-3 text-sm">
      <header className="flex items-center gap-2">
        <h2 className="font-semibold text-amber-300">Class</h2>
        <span className="ml-auto text-xs text-slate-400" data-testid="audience-count">{plural(viewers, 'viewer')} watching</span>
      </header>
      <div className="flex items-center gap-2">
        <select aria-label="Link lifetime" value={lifetime} onChange={(e) => setLifetime(Number(e.target.value))} className="h-7 rounded border border-mat-600 bg-mat-800 px-1 text-xs">
          {LIFETIMES.map((l, i) => <option key={l.label} value={i}>{l.label}</option>)}
        </select>
        <Button size="sm" busy={create.isPending} onClick={() => create.mutate({ expiresInMinutes: LIFETIMES[lifetime].minutes }, { onSuccess: setFresh, onError: (e) => notifyError(e, 'Could not make a share link') })}>
          New share link
        </Button>
      </div>
      {fresh && (
        <div className="space-y-2 rounded border border-mat-600 p-2">
          <p className="text-[11px] text-slate-400">Anyone with this link can watch the board as a guest (read-only). It is shown only now.</p>
          <input readOnly value={fresh.url} aria-label="Share link" data-testid="share-url" onFocus={(e) => e.currentTarget.select()} className="w-full rounded border border-mat-600 bg-mat-900 px-1 font-mono text-[11px]" />
          <LinkQr url={fresh.url} />
        </div>
      )}
      <ul className="space-y-1" aria-label="Share links">
        {(links.data ?? []).map((l) => (
          <li key={l.id} className="flex items-center gap-2 text-xs" data-testid="share-link-row">
            <span className="font-mono text-slate-400">#{l.id}</span>
            <span>{plural(l.audience, 'guest')} in</span>
            <span className="text-slate-500">{l.expiresAt ? `until ${new Date(l.expiresAt).toLocaleString()}` : 'no expiry'}</span>
            <Button size="sm" variant="ghost" className="ml-auto" busy={revoke.isPending && revoke.variables === l.id}
              onClick={() => revoke.mutate(l.id, { onSuccess: () => { if (fresh?.id === l.id) setFresh(null); }, onError: (e) => notifyError(e, 'Could not revoke the link') })}>
              Revoke
            </Button>
          </li>
        ))}
      </ul>
    </section>
  );
}
