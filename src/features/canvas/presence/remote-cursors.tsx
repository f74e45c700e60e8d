/** Collaborators' pointers on the canvas, in flow coordinates, each with its owner's name and colour. */
import { memo } from 'react';
import { ViewportPortal } from '@xyflow/react';
import type { Peer } from '../session/awareness';

function RemoteCursorsView({ peers }: { peers: Peer[] }) {
  return (
    <ViewportPortal>
      {peers.filter((p) => p.cursor).map((p) => (
        <div key={p.clientId} className="gf-remote-cursor" data-testid="remote-cursor"
          style={{ transform: `translate(${p.cursor!.x}px, ${p.cursor!.y}px)`, color: p.user.color }}>
          <svg width="16" height="16" viewBox="0 0 16 16" aria-hidden="true">
            <path d="M1 1 L1 13 L4.5 9.5 L7 15 L9 14 L6.5 8.5 L11.5 8.5 Z" fill="currentColor" stroke="#0d1014" strokeWidth="1" />
          </svg>
          <span className="gf-remote-name" style={{ background: p.user.color }}>{p.user.name}</span>
        </div>
      ))}
    </ViewportPortal>
  );
}

export const RemoteCursors = memo(RemoteCursorsView);
