import type { Redis } from 'ioredis';
import type { AppEventMap, AppEvents } from './events';

/**
 * The app events that close or change sockets, sent to every server (several servers, REDIS_URL): a
 * member removed, a board deleted, sessions ended or a share link revoked on one server reach the
 * sockets on all of them. Each server emits a relayed event on its own emitter, once; its listeners
 * (the socket side, clean-ups) run as if the change were made there. A new event that must reach
 * sockets elsewhere is added to RELAYED.
 */
export const RELAYED = ['membership-changed', 'board-deleted', 'sessions-ended', 'share-link-revoked'] as const;

const CHANNEL = 'gatefold:events';

interface Relayed {
  from: string;
  name: string;
  payload: unknown;
}

/** Starts relaying; returns the stop function. `sub` must be a connection used only for subscriptions. */
export async function relayAppEvents(events: AppEvents, link: { pub: Redis; sub: Redis; serverId: string }): Promise<() => void> {
  const known = new Set<string>(RELAYED);
  let relaying = false;
  const emit = events.emit.bind(events) as (name: string, payload: unknown) => boolean;
  const onLocal = (name: string) => (payload: unknown) => {
    if (relaying) return;
    link.pub.publish(CHANNEL, JSON.stringify({ from: link.serverId, name, payload } satisfies Relayed)).catch((err: Error) => {
      console.warn(`events relay: publishing ${name} failed: ${err.message}`);
    });
  };
  const handlers = RELAYED.map((name) => [name, onLocal(name)] as const);
  for (const [name, h] of handlers) events.on(name as keyof AppEventMap, h as never);
  const onMessage = (channel: string, message: string) => {
    if (channel !== CHANNEL) return;
    let m: Relayed;
    try {
      m = JSON.parse(message) as Relayed;
    } catch {
      return;
    }
    if (m.from === link.serverId || !known.has(m.name)) return;
    relaying = true;
    try {
      emit(m.name, m.payload);
    } finally {
      relaying = false;
    }
  };
  link.sub.on('message', onMessage);
  await link.sub.subscribe(CHANNEL);
  return () => {
    link.sub.off('message', onMessage);
    for (const [name, h] of handlers) events.off(name as keyof AppEventMap, h as never);
  };
}
