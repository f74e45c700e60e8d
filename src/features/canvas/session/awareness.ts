/**
 * Presence through y-websocket awareness. Each client publishes
 * `{user: {id, name, color}, cursor: {x, y} | null, selection: string[], dragging?: {id, x, y}[]}`
 * (cursor and drag positions in flow coordinates). Reading the peers is a pure function.
 */
import { z } from 'zod';

export const PresenceUserSchema = z.object({ id: z.string(), name: z.string(), color: z.string() });
export type PresenceUser = z.infer<typeof PresenceUserSchema>;

const PointSchema = z.object({ x: z.number(), y: z.number() });
export const PresenceStateSchema = z.object({
  user: PresenceUserSchema,
  cursor: PointSchema.nullable().optional(),
  selection: z.array(z.string()).optional(),
  dragging: z.array(z.object({ id: z.string(), x: z.number(), y: z.number() })).nullable().optional(),
});
export type PresenceState = z.infer<typeof PresenceStateSchema>;

export interface Peer {
  clientId: number;
  user: PresenceUser;
  cursor: { x: number; y: number } | null;
  selection: string[];
  /** no renewal of their state for a while: their connection has dropped (they are shown greyed out) */
  away: boolean;
}

/**
 * A client renews its awareness state every 15 s (y-protocols' outdatedTimeout / 2) and others drop it
 * after 30 s; a state not renewed for 20 s belongs to someone whose connection has dropped.
 */
export const AWAY_AFTER_MS = 20_000;

/** When each client's state was last renewed (the awareness `meta`), and the time now, for `away`. */
export interface Freshness {
  meta: ReadonlyMap<number, { lastUpdated: number }>;
  now: number;
}

export interface PeersView {
  /** other clients, one entry per client (a user with two tabs appears twice) */
  peers: Peer[];
  /** part id → colour of a collaborator who has it selected */
  selection: Map<string, string>;
  /** part id → live position while a collaborator drags it */
  dragging: Map<string, { x: number; y: number }>;
}

/** What the other clients show: their cursors, selections and drags. Malformed states are skipped. */
export function readPeers(states: ReadonlyMap<number, unknown>, localClientId: number, fresh?: Freshness): PeersView {
  const view: PeersView = { peers: [], selection: new Map(), dragging: new Map() };
  for (const [clientId, raw] of states) {
    if (clientId === localClientId) continue;
    const parsed = PresenceStateSchema.safeParse(raw);
    if (!parsed.success) continue;
    const s = parsed.data;
    const seen = fresh?.meta.get(clientId)?.lastUpdated;
    const away = fresh !== undefined && seen !== undefined && fresh.now - seen > AWAY_AFTER_MS;
    view.peers.push({ clientId, user: s.user, cursor: s.cursor ?? null, selection: s.selection ?? [], away });
    for (const id of s.selection ?? []) if (!view.selection.has(id)) view.selection.set(id, s.user.color);
    for (const d of s.dragging ?? []) view.dragging.set(d.id, { x: d.x, y: d.y });
  }
  view.peers.sort((a, b) => a.clientId - b.clientId);
  return view;
}

/** Calls `fn` at most once per `ms` with the latest arguments (the last call always gets through). */
export function throttle<A extends unknown[]>(fn: (...args: A) => void, ms: number): ((...args: A) => void) & { flush(): void } {
  let last = 0;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let pending: A | null = null;
  const run = () => {
    timer = null;
    last = Date.now();
    if (pending) { const a = pending; pending = null; fn(...a); }
  };
  const wrapped = (...args: A) => {
    pending = args;
    const wait = ms - (Date.now() - last);
    if (wait <= 0 && !timer) run();
    else if (!timer) timer = setTimeout(run, wait);
  };
  wrapped.flush = () => { if (timer) { clearTimeout(timer); run(); } };
  return wrapped;
}
