/**
 * A client that speaks the y-websocket protocol by hand over a real socket, so a test can send exactly
 * the update it means (a y-websocket provider would resend a refused update on every reconnect).
 * It keeps its own copy of the board (sync step 1 → the server's step 2), edits it with raw Yjs calls,
 * and sends what an edit produced.
 */
import WebSocket from 'ws';
import * as Y from 'yjs';
import * as encoding from 'lib0/encoding';
import * as decoding from 'lib0/decoding';
import * as syncProtocol from 'y-protocols/sync';
import type { TestServer } from '../helpers/test-app';

export interface Closed {
  code: number;
  reason: string;
}

export class RawPeer {
  readonly doc = new Y.Doc();
  /** awareness payloads received (each one message) */
  readonly awareness: Uint8Array[] = [];
  readonly closed: Promise<Closed>;
  private replies: (() => void)[] = [];

  private constructor(readonly ws: WebSocket) {
    this.closed = new Promise((resolve) => ws.once('close', (code, reason) => resolve({ code, reason: reason.toString() })));
    ws.on('message', (data: Buffer) => this.onMessage(new Uint8Array(data)));
  }

  /** Opens a socket on the board and takes the server's whole document. */
  static async open(server: TestServer, boardId: number, cookie: string): Promise<RawPeer> {
    const ws = new WebSocket(server.url.replace(/^http/, 'ws') + `/collab/${boardId}`, { headers: { Cookie: cookie } });
    await new Promise<void>((resolve, reject) => {
      ws.once('open', () => resolve());
      ws.once('error', reject);
    });
    const peer = new RawPeer(ws);
    await peer.roundTrip();
    return peer;
  }

  get isOpen(): boolean {
    return this.ws.readyState === WebSocket.OPEN;
  }

  /** Sends `update` as a sync update message. */
  sendUpdate(update: Uint8Array): void {
    const enc = encoding.createEncoder();
    encoding.writeVarUint(enc, 0);
    syncProtocol.writeUpdate(enc, update);
    this.ws.send(encoding.toUint8Array(enc));
  }

  /** Runs `edit` on the local copy and sends the update it made; returns the update. */
  edit(edit: (doc: Y.Doc) => void): Uint8Array {
    const before = Y.encodeStateVector(this.doc);
    edit(this.doc);
    const update = Y.encodeStateAsUpdate(this.doc, before);
    this.sendUpdate(update);
    return update;
  }

  /** Sends an awareness payload (y-protocols awareness encoding) as one message. */
  sendAwareness(payload: Uint8Array): void {
    const enc = encoding.createEncoder();
    encoding.writeVarUint(enc, 1);
    encoding.writeVarUint8Array(enc, payload);
    this.ws.send(encoding.toUint8Array(enc));
  }

  /**
   * Asks the server for what we lack (sync step 1) and waits for its answer: the server handles a
   * socket's messages in order, so everything sent before has been handled. Resolves 'closed' when
   * the server closed the socket instead.
   */
  async roundTrip(timeoutMs = 5000): Promise<'answered' | 'closed'> {
    if (!this.isOpen) return 'closed';
    const answered = new Promise<'answered'>((resolve) => this.replies.push(() => resolve('answered')));
    const enc = encoding.createEncoder();
    encoding.writeVarUint(enc, 0);
    syncProtocol.writeSyncStep1(enc, this.doc);
    this.ws.send(encoding.toUint8Array(enc));
    const timeout = new Promise<never>((_, reject) => setTimeout(() => reject(new Error('no answer from the server')), timeoutMs));
    return Promise.race([answered, this.closed.then(() => 'closed' as const), timeout]);
  }

  close(): void {
    this.ws.close();
  }

  private onMessage(data: Uint8Array): void {
    const d = decoding.createDecoder(data);
    const type = decoding.readVarUint(d);
    if (type === 1) {
      this.awareness.push(decoding.readVarUint8Array(d));
      return;
    }
    if (type !== 0) return;
    const step = decoding.readVarUint(d);
    if (step === 0) return; // the server's step 1: we never send it our edits uninvited
    Y.applyUpdate(this.doc, decoding.readVarUint8Array(d), 'server');
    if (step === 1) this.replies.shift()?.();
  }
}

/** A y-protocols awareness payload speaking for `clientId`. */
export function awarenessPayload(entries: { clientId: number; clock: number; state: unknown }[]): Uint8Array {
  const enc = encoding.createEncoder();
  encoding.writeVarUint(enc, entries.length);
  for (const e of entries) {
    encoding.writeVarUint(enc, e.clientId);
    encoding.writeVarUint(enc, e.clock);
    encoding.writeVarString(enc, JSON.stringify(e.state));
  }
  return encoding.toUint8Array(enc);
}

/** Client ids and states of an awareness payload. */
export function awarenessEntries(payload: Uint8Array): { clientId: number; clock: number; state: unknown }[] {
  const d = decoding.createDecoder(payload);
  const n = decoding.readVarUint(d);
  const out: { clientId: number; clock: number; state: unknown }[] = [];
  for (let i = 0; i < n; i++) out.push({ clientId: decoding.readVarUint(d), clock: decoding.readVarUint(d), state: JSON.parse(decoding.readVarString(d)) as unknown });
  return out;
}
