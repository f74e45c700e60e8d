import { useEffect, useState } from 'react';

interface AwarenessLike {
  getStates(): Map<number, unknown>;
  on(event: 'change', cb: () => void): void;
  off(event: 'change', cb: () => void): void;
}

/** Viewers watching the board: the server's own presence entry `{audience: {viewers}}` (viewers' states stay on the server). */
export function useAudience(awareness: AwarenessLike): number {
  const read = () => {
    for (const s of awareness.getStates().values()) {
      const n = (s as { audience?: { viewers?: unknown } } | null)?.audience?.viewers;
      if (typeof n === 'number') return n;
    }
    return 0;
  };
  const [viewers, setViewers] = useState(read);
  useEffect(() => {
    const on = () => setViewers(read());
    awareness.on('change', on);
    on();
    return () => awareness.off('change', on);
  }, [awareness]);
  return viewers;
}

/** A raised hand in the server's audience entry: the viewer's awareness client id and display name. */
export interface RaisedHand {
  id: number;
  name: string;
}

function handsOf(awareness: AwarenessLike): RaisedHand[] {
  for (const s of awareness.getStates().values()) {
    const hands = (s as { audience?: { hands?: unknown } } | null)?.audience?.hands;
    if (Array.isArray(hands)) {
      return hands.filter((h): h is RaisedHand => !!h && typeof (h as RaisedHand).id === 'number' && typeof (h as RaisedHand).name === 'string');
    }
  }
  return [];
}

/**
 * Raised hands, from the server's audience entry `{audience: {viewers, hands: [{id, name}]}}`. A viewer
 * raises a hand with its own awareness field `hand: true`; an editor clears hands with
 * `clearHands: {seq, ids | 'all'}` (server/boards-live/presence.ts).
 */
export function useHands(awareness: AwarenessLike): RaisedHand[] {
  const [hands, setHands] = useState(() => handsOf(awareness));
  useEffect(() => {
    const on = () => {
      const next = handsOf(awareness);
      setHands((prev) => (JSON.stringify(prev) === JSON.stringify(next) ? prev : next));
    };
    awareness.on('change', on);
    on();
    return () => awareness.off('change', on);
  }, [awareness]);
  return hands;
}
