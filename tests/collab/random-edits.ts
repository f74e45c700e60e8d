/**
 * fast-check arbitraries of well-formed Yjs edits on a board document that are mostly NOT valid board
 * edits: fields of the wrong type or range, unknown kinds and fields, entries that are not maps,
 * wires between odd pins, long titles — what a hostile or broken client can send.
 */
import fc from 'fast-check';
import * as Y from 'yjs';
import { PART_FIELDS, addPart, connect, metaMap, partsMap, wiresMap } from '../../shared/board';

const value = fc.oneof(
  fc.string({ maxLength: 8 }),
  fc.integer({ min: -5, max: 1000 }),
  fc.double({ noNaN: false }),
  fc.boolean(),
  fc.constant(null),
  fc.constantFrom('and', 'lamp', 'switch', 'flux', 'A', 'B', 'A B', 'sw1.out', 'g1.in0', 'g1.in7', 'l1.in', 'nope'),
  fc.array(fc.integer(), { maxLength: 2 }),
);
const partField = fc.constantFrom(...PART_FIELDS, 'order', 'junk');
const wireField = fc.constantFrom('id', 'from', 'to', 'order', 'junk');
const where = fc.constantFrom('parts' as const, 'wires' as const);
const key = fc.constantFrom('sw1', 'g1', 'l1', 'w1', 'n1', 'n2');

export type RawEdit =
  | { op: 'set-field'; where: 'parts' | 'wires'; key: string; field: string; value: unknown }
  | { op: 'delete-field'; where: 'parts' | 'wires'; key: string; field: string }
  | { op: 'set-entry'; where: 'parts' | 'wires'; key: string; value: unknown }
  | { op: 'new-map'; where: 'parts' | 'wires'; key: string; fields: Record<string, unknown> }
  | { op: 'delete-entry'; where: 'parts' | 'wires'; key: string }
  | { op: 'meta'; key: string; value: unknown };

export const rawEdit: fc.Arbitrary<RawEdit> = fc.oneof(
  fc.record({ op: fc.constant('set-field' as const), where, key, field: fc.oneof(partField, wireField), value }),
  fc.record({ op: fc.constant('delete-field' as const), where, key, field: fc.oneof(partField, wireField) }),
  fc.record({ op: fc.constant('set-entry' as const), where, key, value }),
  fc.record({ op: fc.constant('new-map' as const), where, key, fields: fc.dictionary(fc.oneof(partField, wireField), value, { maxKeys: 6 }) }),
  fc.record({ op: fc.constant('delete-entry' as const), where, key }),
  fc.record({ op: fc.constant('meta' as const), key: fc.constantFrom('title', 'family', 'other'), value: fc.oneof(value, fc.string({ maxLength: 300 }), fc.constantFrom('ttl-74ls', 'relay')) }),
);

/** Applies raw edits in one transaction (no checks: that is the point). */
export function applyRawEdits(doc: Y.Doc, edits: RawEdit[]): void {
  doc.transact(() => {
    for (const e of edits) {
      if (e.op === 'meta') {
        metaMap(doc).set(e.key, e.value);
        continue;
      }
      const map = e.where === 'parts' ? partsMap(doc) : wiresMap(doc);
      const entry = map.get(e.key) as unknown;
      switch (e.op) {
        case 'set-field':
          if (entry instanceof Y.Map) entry.set(e.field, e.value);
          break;
        case 'delete-field':
          if (entry instanceof Y.Map) entry.delete(e.field);
          break;
        case 'set-entry':
          map.set(e.key, e.value as never);
          break;
        case 'new-map': {
          const m = new Y.Map<unknown>();
          for (const [k, v] of Object.entries(e.fields)) m.set(k, v);
          map.set(e.key, m as never);
          break;
        }
        case 'delete-entry':
          map.delete(e.key);
          break;
        default: {
          const never: never = e;
          throw new Error(`unknown raw edit ${JSON.stringify(never)}`);
        }
      }
    }
  });
}

/** The valid board every run starts from: a switch, a 2-input AND, a lamp, a wire. */
export function startingBoard(doc: Y.Doc): void {
  const me = { local: 'seed' };
  addPart(doc, { id: 'sw1', kind: 'switch', label: 'A', x: 0, y: 0, on: false }, me);
  addPart(doc, { id: 'g1', kind: 'and', inputs: 2, x: 100, y: 0 }, me);
  addPart(doc, { id: 'l1', kind: 'lamp', label: 'Y', x: 200, y: 0 }, me);
  connect(doc, 'sw1.out', 'g1.in0', me);
}
