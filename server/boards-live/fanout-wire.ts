import { createHash } from 'node:crypto';
import * as encoding from 'lib0/encoding';
import * as decoding from 'lib0/decoding';

/**
 * The messages servers exchange on a board's Redis channel (fanout-redis.ts), binary, lib0-encoded:
 * the type, the sending server's id, then the type's fields.
 */
export type FanoutMessage =
  /** a document update the sender applied from its own sockets or itself; it stores it */
  | { type: 'update'; from: string; id: string; data: Uint8Array }
  /** the sender stored these updates (ids as in `update`) */
  | { type: 'stored'; from: string; ids: string[] }
  /** a room just opened on the sender: whoever has the board open answers with what it lacks */
  | { type: 'sync-request'; from: string; stateVector: Uint8Array }
  | { type: 'sync-reply'; from: string; to: string; data: Uint8Array }
  /** editors' presence from the sender's sockets (a y-protocols awareness update) */
  | { type: 'awareness'; from: string; data: Uint8Array };

const TYPES = ['update', 'stored', 'sync-request', 'sync-reply', 'awareness'] as const;

/** The id of an update: a hash of its bytes (the same bytes are published and stored). */
export function updateId(data: Uint8Array): string {
  return createHash('sha1').update(data).digest('base64url').slice(0, 22);
}

export function encodeFanout(m: FanoutMessage): Uint8Array {
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, TYPES.indexOf(m.type));
  encoding.writeVarString(e, m.from);
  switch (m.type) {
    case 'update':
      encoding.writeVarString(e, m.id);
      encoding.writeVarUint8Array(e, m.data);
      break;
    case 'stored':
      encoding.writeVarUint(e, m.ids.length);
      for (const id of m.ids) encoding.writeVarString(e, id);
      break;
    case 'sync-request':
      encoding.writeVarUint8Array(e, m.stateVector);
      break;
    case 'sync-reply':
      encoding.writeVarString(e, m.to);
      encoding.writeVarUint8Array(e, m.data);
      break;
    case 'awareness':
      encoding.writeVarUint8Array(e, m.data);
      break;
    default: {
      const never: never = m;
      throw new Error(`unknown fan-out message ${JSON.stringify(never)}`);
    }
  }
  return encoding.toUint8Array(e);
}

/** Decodes one message; throws on bytes that are not one. */
export function decodeFanout(bytes: Uint8Array): FanoutMessage {
  const d = decoding.createDecoder(bytes);
  const type = TYPES[decoding.readVarUint(d)];
  const from = decoding.readVarString(d);
  switch (type) {
    case 'update':
      return { type, from, id: decoding.readVarString(d), data: decoding.readVarUint8Array(d) };
    case 'stored': {
      const n = decoding.readVarUint(d);
      const ids: string[] = [];
      for (let i = 0; i < n; i++) ids.push(decoding.readVarString(d));
      return { type, from, ids };
    }
    case 'sync-request':
      return { type, from, stateVector: decoding.readVarUint8Array(d) };
    case 'sync-reply':
      return { type, from, to: decoding.readVarString(d), data: decoding.readVarUint8Array(d) };
    case 'awareness':
      return { type, from, data: decoding.readVarUint8Array(d) };
    default:
      throw new Error('unknown fan-out message type');
  }
}
