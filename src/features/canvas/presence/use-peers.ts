/** Other clients on the board as seen through awareness, re-read at most once per animation frame. */
import { useEffect, useState } from 'react';
import type { WebsocketProvider } from 'y-websocket';
import { readPeers, type PeersView } from '../session/awareness';

const NONE: PeersView = { peers: [], selection: new Map(), dragging: new Map() };

export function usePeers(provider: WebsocketProvider): PeersView {
  const [view, setView] = useState<PeersView>(NONE);
  useEffect(() => {
    const aw = provider.awareness;
    let raf = 0;
    const read = () => { raf = 0; setView((prev) => keepSame(prev, readPeers(aw.getStates(), aw.clientID, { meta: aw.meta, now: Date.now() }))); };
    const onChange = () => { if (!raf) raf = requestAnimationFrame(read); };
    aw.on('change', onChange);
    // a peer whose connection dropped sends nothing: look again now and then to grey them out
    const tick = setInterval(onChange, 5000);
    read();
    return () => { aw.off('change', onChange); clearInterval(tick); if (raf) cancelAnimationFrame(raf); };
  }, [provider]);
  return view;
}

function sameMap<V>(a: ReadonlyMap<string, V>, b: ReadonlyMap<string, V>, eq: (x: V, y: V) => boolean): boolean {
  if (a.size !== b.size) return false;
  for (const [k, v] of a) { const w = b.get(k); if (w === undefined || !eq(v, w)) return false; }
  return true;
}

/** Keeps the previous selection and drag maps when their content is unchanged (cursor moves then re-render only the cursors). */
function keepSame(prev: PeersView, next: PeersView): PeersView {
  return {
    peers: next.peers,
    selection: sameMap(prev.selection, next.selection, (x, y) => x === y) ? prev.selection : next.selection,
    dragging: sameMap(prev.dragging, next.dragging, (x, y) => x.x === y.x && x.y === y.y) ? prev.dragging : next.dragging,
  };
}
