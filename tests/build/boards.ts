/** Small boards for the build tests: one gate between two inputs and a lamp, chains of gates, the demo logic unit. */
import { readFileSync } from 'node:fs';
import { BoardFileSchema, parseBoardFile, type BoardFile, type FamilyId } from '../../shared/board';

export type OneGateKind = 'not' | 'and' | 'or' | 'nand' | 'nor' | 'xor' | 'xnor';

/**
 * Inputs A, B → one gate → lamp Y. Switches give their complement pin (`outn`); clocks have none, so
 * `source: 'clock'` is the "NOR only / NAND only" column of CHECKS.md and switches the "complements available" one.
 */
export function oneGate(kind: OneGateKind, source: 'switch' | 'clock' = 'switch', family: FamilyId = 'ideal'): BoardFile {
  const gate = kind === 'not' ? { id: 'g', kind, x: 160, y: 40 } : { id: 'g', kind, inputs: 2, x: 160, y: 40 };
  return BoardFileSchema.parse({
    format: 'gatefold-board', version: 1, title: `one ${kind}`, family,
    parts: [
      { id: 'a', kind: source, label: 'A', x: 20, y: 20 }, { id: 'b', kind: source, label: 'B', x: 20, y: 100 },
      gate, { id: 'y', kind: 'lamp', label: 'Y', x: 300, y: 40 },
    ],
    wires: [
      { id: 'w1', from: 'a.out', to: 'g.in0' },
      ...(kind === 'not' ? [] : [{ id: 'w2', from: 'b.out', to: 'g.in1' }]),
      { id: 'w3', from: 'g.out', to: 'y.in' },
    ],
  });
}

/** A switch, `n` gates of `kind` in a chain (each gate's inputs tied), a lamp. */
export function chain(n: number, kind: 'nand' | 'nor' | 'not', family: FamilyId): BoardFile {
  const parts: unknown[] = [{ id: 'a', kind: 'switch', label: 'A', x: 0, y: 0 }];
  const wires: { id: string; from: string; to: string }[] = [];
  let prev = 'a.out';
  for (let i = 0; i < n; i++) {
    parts.push(kind === 'not' ? { id: `g${i}`, kind, x: 100 + 60 * i, y: 0 } : { id: `g${i}`, kind, inputs: 2, x: 100 + 60 * i, y: 0 });
    wires.push({ id: `w${wires.length}`, from: prev, to: `g${i}.in0` });
    if (kind !== 'not') wires.push({ id: `w${wires.length}`, from: prev, to: `g${i}.in1` });
    prev = `g${i}.out`;
  }
  parts.push({ id: 'y', kind: 'lamp', label: 'Y', x: 200 + 60 * n, y: 0 });
  wires.push({ id: `w${wires.length}`, from: prev, to: 'y.in' });
  return BoardFileSchema.parse({ format: 'gatefold-board', version: 1, title: `chain of ${n}`, family, parts, wires });
}

/** `n` independent two-input gates of `kind`, each between switches and a lamp. */
export function gates(n: number, kind: 'nand' | 'nor', family: FamilyId): BoardFile {
  const parts: unknown[] = [{ id: 'a', kind: 'switch', label: 'A', x: 0, y: 0 }, { id: 'b', kind: 'switch', label: 'B', x: 0, y: 60 }];
  const wires: { id: string; from: string; to: string }[] = [];
  for (let i = 0; i < n; i++) {
    parts.push({ id: `g${i}`, kind, inputs: 2, x: 100, y: 60 * i }, { id: `y${i}`, kind: 'lamp', label: `Y${i}`, x: 200, y: 60 * i });
    wires.push({ id: `a${i}`, from: 'a.out', to: `g${i}.in0` }, { id: `b${i}`, from: 'b.out', to: `g${i}.in1` }, { id: `o${i}`, from: `g${i}.out`, to: `y${i}.in` });
  }
  return BoardFileSchema.parse({ format: 'gatefold-board', version: 1, title: `${n} ${kind}`, family, parts, wires });
}

export const EXAMPLE_PATH = new URL('../../examples/tube-logic-unit.gatefold.json', import.meta.url);

/** The tube group's logic unit (examples/tube-logic-unit.gatefold.json). */
export function tubeLogicUnit(): { text: string; board: BoardFile } {
  const text = readFileSync(EXAMPLE_PATH, 'utf8');
  const parsed = parseBoardFile(JSON.parse(text));
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('; '));
  return { text, board: parsed.board };
}
