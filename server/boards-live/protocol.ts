/**
 * The y-websocket wire format (y-protocols): message types and the pieces of it the room reads itself.
 */
import * as decoding from 'lib0/decoding';

/** Message types of the y-websocket protocol. */
export const MSG = { sync: 0, awareness: 1, auth: 2, queryAwareness: 3 } as const;
export const SYNC = { step1: 0, step2: 1, update: 2 } as const;

/** The client ids an awareness update speaks for (y-protocols awareness encoding: count, then id, clock, state). */
export function awarenessClients(update: Uint8Array): number[] {
  const d = decoding.createDecoder(update);
  const n = decoding.readVarUint(d);
  const ids: number[] = [];
  for (let i = 0; i < n; i++) {
    ids.push(decoding.readVarUint(d));
    decoding.readVarUint(d);
    decoding.readVarString(d);
  }
  return ids;
}
