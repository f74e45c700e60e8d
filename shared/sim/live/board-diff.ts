import type { BoardFile, Part } from '../../board';

/**
 * Fields that never change what the circuit does (position, look, names) or that are input values set
 * live. A label only names a signal: relabelling a lamp must not reset a counter (see `labelKey`).
 */
const NON_STRUCTURAL = new Set(['x', 'y', 'rotation', 'text', 'on', 'pressed', 'label']);

/**
 * A key that changes only when the circuit itself changes (parts, their wiring, kinds, family), not
 * when a part moves, is relabelled or a switch flips. Equal keys let the worker keep its simulator — and
 * with it every stored bit — and only set the new input values (and names).
 */
export function structureKey(board: BoardFile): string {
  // Plain string building: this runs on every board change, and JSON with sorted keys cost ~80 ms for
  // 5000 parts. Field order comes from the schema; a different order only costs one extra recompile.
  let key = board.family;
  for (const part of board.parts) {
    if (part.kind === 'note') continue;
    key += '\u0001';
    for (const field in part) {
      if (!NON_STRUCTURAL.has(field)) key += `${field}=${String((part as Record<string, unknown>)[field])};`;
    }
  }
  for (const w of board.wires) key += `\u0002${w.from}>${w.to}`;
  // a module's inside is part of the circuit; its ports' labels are its instances' pin names
  for (const m of board.modules ?? []) {
    key += `\u0003${m.id}`;
    for (const part of m.parts) {
      if (part.kind === 'note' || part.kind === 'lamp' || part.kind === 'probe') continue;
      key += '\u0001';
      for (const field in part) {
        if (!NON_STRUCTURAL.has(field) || (part.kind === 'port' && field === 'label')) key += `${field}=${String((part as Record<string, unknown>)[field])};`;
      }
    }
    for (const w of m.wires) key += `\u0002${w.from}>${w.to}`;
  }
  return key;
}

/** The parts' labels, as one comparable string: when only this changes, the signals are renamed. */
export function labelKey(board: BoardFile): string {
  let key = '';
  for (const part of board.parts) if (part.label !== undefined) key += `${part.id}=${part.label}\u0001`;
  return key;
}

/** The value a document gives an input part (switch `on`, button `pressed`), undefined for other kinds. */
export function documentValue(part: Part): boolean | undefined {
  switch (part.kind) {
    case 'switch':
      return part.on;
    case 'button':
      return part.pressed;
    default:
      return undefined;
  }
}

/** The input values a board sets (switches and buttons, in file order), as one comparable string. */
export function inputSignature(board: BoardFile): string {
  let sig = '';
  for (const p of board.parts) {
    const v = documentValue(p);
    if (v !== undefined) sig += `${p.id}=${v ? 1 : 0};`;
  }
  return sig;
}
