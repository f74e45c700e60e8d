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
