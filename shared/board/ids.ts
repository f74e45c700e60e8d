/**
 * Short readable ids for new parts and wires (`g7_k2p`, `w12_k2p`): a prefix by kind, a number, and a tag
 * of the creating client, so that two users adding a part at the same moment never pick the same id
 * (in a Y.Map the later of two equal keys would silently replace the other part).
 */
import type * as Y from 'yjs';
import type { PartKind } from './kinds';
import { partsMap, wiresMap } from './ydoc';

/** Readable id prefixes per kind. */
const ID_PREFIX: Record<PartKind, string> = {
  switch: 'sw', button: 'btn', clock: 'clk', const: 'k', lamp: 'lamp', probe: 'probe',
  buffer: 'g', not: 'g', and: 'g', or: 'g', nand: 'g', nor: 'g', xor: 'g', xnor: 'g',
  srlatch: 'ff', dlatch: 'ff', dff: 'ff', mux2: 'mux', mux4: 'mux', note: 'note', port: 'p', module: 'u',
};

/** A short tag of this document's client, so that two users adding a part at once never pick one id. */
function clientTag(doc: Y.Doc): string {
  return (doc.clientID % 46656).toString(36);
}

function freshId(doc: Y.Doc, prefix: string, taken: (id: string) => boolean): string {
  const tag = clientTag(doc);
  for (let n = 1; ; n++) {
    const id = `${prefix}${n}_${tag}`;
    if (!taken(id)) return id;
  }
}

/** A new unique part id such as `g7_k2p` (prefix by kind, a number, this client's tag). */
export function newPartId(doc: Y.Doc, kind: PartKind): string {
  const parts = partsMap(doc);
  return freshId(doc, ID_PREFIX[kind] ?? 'p', (id) => parts.has(id));
}

/** A new unique wire id such as `w12_k2p`. */
export function newWireId(doc: Y.Doc): string {
  const wires = wiresMap(doc);
  return freshId(doc, 'w', (id) => wires.has(id));
}

