import * as awarenessProtocol from 'y-protocols/awareness';
import * as encoding from 'lib0/encoding';
import * as decoding from 'lib0/decoding';
import type { WebSocket } from 'ws';
import { MSG } from './protocol';
import { CLOSE, SocketRefusal, type CollabOptions, type Peer } from './types';

/** What presence needs of a room's socket. */
export interface PresenceConn {
  ws: WebSocket;
  peer: Peer;
  /** awareness client ids this socket speaks for (removed when it leaves) */
  clients: Set<number>;
}

/** A raised hand: the viewer's awareness client id and its display name. */
export interface RaisedHand {
  id: number;
  name: string;
}

/**
 * The server's own awareness entry: how many viewers are watching and whose hand is up (viewers' own
 * states are not sent out). A viewer raises a hand with its awareness field `hand: true` (named by its
 * `user.name`); an editor clears hands with its field `clearHands: {seq, ids}` (`ids` a list of hand
 * ids or `'all'`, `seq` a number changed for each clear): a cleared hand stays down until that viewer
 * lowers and raises it again.
 */
export interface AudienceState {
  audience: { viewers: number; hands: RaisedHand[] };
}

/** What of a state's JSON the hands need: the viewer's hand and name, the editor's clear request. */
function handFields(json: string): { hand: boolean; name: string; clear: { key: string; ids: number[] | 'all' } | null } {
  let s: unknown;
  try {
    s = JSON.parse(json);
  } catch {
    return { hand: false, name: '', clear: null };
  }
  const o = (s && typeof s === 'object' ? s : {}) as { hand?: unknown; user?: { name?: unknown }; clearHands?: { seq?: unknown; ids?: unknown } };
  const rawName = typeof o.user?.name === 'string' ? o.user.name.trim().slice(0, 60) : '';
  const c = o.clearHands;
  const ids: number[] | 'all' | null = c && typeof c === 'object' ? (c.ids === 'all' ? 'all' : Array.isArray(c.ids) ? c.ids.filter((x): x is number => Number.isInteger(x)) : null) : null;
  const clear = ids && typeof c?.seq === 'number' ? { key: `${c.seq}`, ids } : null;
  return { hand: o.hand === true, name: rawName || 'Guest', clear };
}

interface Bucket {
  tokens: number;
  at: number;
}

/** One entry of an awareness update: client id, clock and the state as JSON text. */
function entriesOf(update: Uint8Array): { id: number; clock: number; json: string }[] {
  const d = decoding.createDecoder(update);
  const n = decoding.readVarUint(d);
  const out: { id: number; clock: number; json: string }[] = [];
  for (let i = 0; i < n; i++) out.push({ id: decoding.readVarUint(d), clock: decoding.readVarUint(d), json: decoding.readVarString(d) });
  return out;
}

/**
 * A room's presence (y-protocols awareness) without the square. Sending every awareness message to
 * every socket costs sockets² messages: 230 sockets renewing every 15 s, editors' cursors at 5 Hz.
 * Here:
 * - editors' changed states are gathered and sent to everyone once per frame (`awarenessFrameMs`),
 *   one message holding the latest state of each client that changed;
 * - renewals (same state, newer clock — y-protocols sends one every 15 s so others keep the state)
 *   are gathered for `awarenessRenewalMs` and sent in one message;
 * - viewers' states stay on the server: everyone gets the server's own entry `{audience: {viewers}}`
 *   instead. That entry is renewed every 15 s by y-protocols itself and sent to every socket, which
 *   is what keeps a quiet socket alive (the y-websocket client reconnects after 30 s of silence);
 * - each socket's awareness messages are limited in size, in client ids and in rate (SocketRefusal).
 */
export class Presence {
  /** editors' client ids whose state everyone has (or will have at the next frame) */
  private readonly published = new Set<number>();
  private readonly dirty = new Set<number>();
  private readonly renewed = new Set<number>();
  private readonly lastJson = new Map<number, string>();
  private readonly buckets = new WeakMap<PresenceConn, Bucket>();
  private frameTimer: ReturnType<typeof setTimeout> | null = null;
  private renewalTimer: ReturnType<typeof setTimeout> | null = null;
  private viewers = 0;
  /** raised hands by viewer client id, in the order raised */
  private readonly hands = new Map<number, string>();
  /** viewers whose raised hand an editor cleared: ignored until they lower it */
  private readonly cleared = new Set<number>();
  /** each editor client's last applied clear request */
  private readonly clearSeen = new Map<number, string>();
  private audienceJson = '';

  constructor(
    readonly awareness: awarenessProtocol.Awareness,
    private readonly conns: ReadonlyMap<WebSocket, PresenceConn>,
    private readonly options: () => CollabOptions,
    private readonly sendTo: (conn: PresenceConn, data: Uint8Array) => void,
  ) {
    awareness.setLocalState({ audience: { viewers: 0, hands: [] } } satisfies AudienceState);
    this.audienceJson = JSON.stringify({ viewers: 0, hands: [] });
    awareness.on('update', this.onUpdate);
  }

  /** The message a socket gets when it joins or asks (queryAwareness): editors' states and the audience. */
  snapshot(): Uint8Array | null {
    const ids = [this.awareness.clientID, ...this.published].filter((id) => this.awareness.meta.has(id));
    return ids.length ? this.message(ids) : null;
  }

  /** Someone joined, left or changed role: the audience count follows at the next frame. */
  audienceChanged(): void {
    this.schedule();
  }

  /** Removes the states a leaving socket spoke for (others see the editors' ones go at the next frame). */
  leave(conn: PresenceConn): void {
    if (conn.clients.size) awarenessProtocol.removeAwarenessStates(this.awareness, [...conn.clients], null);
    conn.clients.forEach((id) => this.forgetHand(id));
    this.schedule();
  }

  /** One awareness message from `conn`; throws SocketRefusal past a limit. */
  receive(conn: PresenceConn, update: Uint8Array): void {
    const { maxAwarenessBytes, maxAwarenessClients } = this.options();
    if (update.byteLength > maxAwarenessBytes) {
      throw new SocketRefusal(CLOSE.awarenessTooLarge, 'awareness_too_large', `presence message of ${update.byteLength} bytes (limit ${maxAwarenessBytes})`);
    }
    this.spend(conn);
    const entries = entriesOf(update);
    // A socket speaks only for its own clients: never move or hide someone else's cursor, or the server's entry.
    if (entries.some(({ id }) => id === this.awareness.clientID || this.ownedByOther(id, conn))) return;
    const speaking = new Set(conn.clients);
    for (const e of entries) if (e.json !== 'null') speaking.add(e.id);
    if (speaking.size > maxAwarenessClients) {
      throw new SocketRefusal(CLOSE.awarenessTooLarge, 'awareness_too_large', `speaks for ${speaking.size} presence clients (limit ${maxAwarenessClients})`);
    }
    const before = new Map(entries.map(({ id }) => [id, { clock: this.awareness.meta.get(id)?.clock ?? -1, had: this.awareness.states.has(id) }]));
    awarenessProtocol.applyAwarenessUpdate(this.awareness, update, conn.ws);
    const editor = conn.peer.role !== 'viewer';
    for (const { id, json } of entries) {
      const was = before.get(id)!;
      // applied: a newer clock, or (y-protocols) a removal at the same clock
      const applied = (this.awareness.meta.get(id)?.clock ?? -1) !== was.clock || (was.had && !this.awareness.states.has(id));
      if (!applied) continue;
      const changed = this.lastJson.get(id) !== json;
      if (json === 'null') this.lastJson.delete(id);
      else this.lastJson.set(id, json);
      if (changed) this.handsFrom(id, json, editor);
      if (json === 'null') {
        if (this.published.delete(id)) this.mark(this.dirty, id);
      } else if (editor) {
        this.published.add(id);
        this.mark(changed ? this.dirty : this.renewed, id);
      }
    }
  }

  destroy(): void {
    if (this.frameTimer) clearTimeout(this.frameTimer);
    if (this.renewalTimer) clearTimeout(this.renewalTimer);
    this.awareness.off('update', this.onUpdate);
  }

  private onUpdate = ({ added, removed }: { added: number[]; updated: number[]; removed: number[] }, origin: unknown): void => {
    if (origin === 'local') {
      // the server's own entry: a new audience count, or y-protocols' 15 s renewal of it
      return this.sendAll(this.message([this.awareness.clientID]));
    }
    const conn = this.conns.get(origin as WebSocket);
    if (conn) {
      added.forEach((id) => conn.clients.add(id));
      removed.forEach((id) => conn.clients.delete(id));
      return;
    }
    // a socket left (origin null) or a state timed out: editors' states go from every screen
    for (const id of removed) {
      this.lastJson.delete(id);
      this.forgetHand(id);
      if (this.published.delete(id)) this.mark(this.dirty, id);
    }
  };

  private mark(set: Set<number>, id: number): void {
    set.add(id);
    if (set === this.renewed) {
      this.renewalTimer ??= setTimeout(this.flushRenewals, this.options().awarenessRenewalMs);
    } else this.schedule();
  }

  private schedule(): void {
    this.frameTimer ??= setTimeout(this.flushFrame, this.options().awarenessFrameMs);
  }

  private flushFrame = (): void => {
    this.frameTimer = null;
    let viewers = 0;
    for (const c of this.conns.values()) if (c.peer.role === 'viewer') viewers++;
    const hands = [...this.hands].map(([id, name]) => ({ id, name }));
    const audience = { viewers, hands };
    const json = JSON.stringify(audience);
    if (viewers !== this.viewers || json !== this.audienceJson) {
      this.viewers = viewers;
      this.audienceJson = json;
      this.awareness.setLocalState({ audience } satisfies AudienceState);
    }
    const ids = [...this.dirty].filter((id) => this.awareness.meta.has(id));
    this.dirty.clear();
    ids.forEach((id) => this.renewed.delete(id));
    if (ids.length) this.sendAll(this.message(ids));
  };

  private flushRenewals = (): void => {
    this.renewalTimer = null;
    const ids = [...this.renewed].filter((id) => this.published.has(id) && this.awareness.meta.has(id));
    this.renewed.clear();
    if (ids.length) this.sendAll(this.message(ids));
  };

  /** A changed state: a viewer's hand up or down, or an editor's new clear request. */
  private handsFrom(id: number, json: string, editor: boolean): void {
    if (json === 'null') return this.forgetHand(id);
    const f = handFields(json);
    if (editor) {
      if (!f.clear || this.clearSeen.get(id) === f.clear.key) return;
      this.clearSeen.set(id, f.clear.key);
      const ids = f.clear.ids === 'all' ? [...this.hands.keys()] : f.clear.ids.filter((h) => this.hands.has(h));
      for (const h of ids) {
        this.hands.delete(h);
        this.cleared.add(h);
      }
      if (ids.length) this.schedule();
      return;
    }
    if (!f.hand) {
      this.cleared.delete(id);
      if (this.hands.delete(id)) this.schedule();
    } else if (!this.cleared.has(id) && this.hands.get(id) !== f.name) {
      this.hands.set(id, f.name);
      this.schedule();
    }
  }

  private forgetHand(id: number): void {
    this.cleared.delete(id);
    this.clearSeen.delete(id);
    if (this.hands.delete(id)) this.schedule();
  }

  /** Token bucket: `awarenessPerSecond` on average, bursts of twice that. */
  private spend(conn: PresenceConn): void {
    const rate = this.options().awarenessPerSecond;
    const now = Date.now();
    const b = this.buckets.get(conn) ?? { tokens: 2 * rate, at: now };
    b.tokens = Math.min(2 * rate, b.tokens + ((now - b.at) / 1000) * rate);
    b.at = now;
    this.buckets.set(conn, b);
    if (b.tokens < 1) throw new SocketRefusal(CLOSE.awarenessRate, 'awareness_rate', `more than ${rate} presence messages per second`);
    b.tokens -= 1;
  }

  private ownedByOther(id: number, conn: PresenceConn): boolean {
    for (const other of this.conns.values()) if (other !== conn && other.clients.has(id)) return true;
    return false;
  }

  private message(ids: number[]): Uint8Array {
    const enc = encoding.createEncoder();
    encoding.writeVarUint(enc, MSG.awareness);
    encoding.writeVarUint8Array(enc, awarenessProtocol.encodeAwarenessUpdate(this.awareness, ids));
    return encoding.toUint8Array(enc);
  }

  private sendAll(data: Uint8Array): void {
    for (const conn of this.conns.values()) this.sendTo(conn, data);
  }
}
