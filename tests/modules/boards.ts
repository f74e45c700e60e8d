/** Small boards with modules for the module tests, written out by hand. */
import { parseBoardFile, type BoardFile } from '../../shared/board';

function checked(raw: unknown): BoardFile {
  const parsed = parseBoardFile(raw);
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('; '));
  return parsed.board;
}

/** The half adder of CONTRACTS §1 as a module (ports A, B → S, C). */
export const HALF_ADDER_MODULE = {
  id: 'half', title: 'Half adder',
  parts: [
    { id: 'a', kind: 'port', dir: 'in', label: 'A', x: 0, y: 40 },
    { id: 'b', kind: 'port', dir: 'in', label: 'B', x: 0, y: 120 },
    { id: 'g1', kind: 'xor', inputs: 2, x: 200, y: 60 },
    { id: 'g2', kind: 'and', inputs: 2, x: 200, y: 140 },
    { id: 's', kind: 'port', dir: 'out', label: 'S', x: 360, y: 60 },
    { id: 'c', kind: 'port', dir: 'out', label: 'C', x: 360, y: 140 },
  ],
  wires: [
    { id: 'w1', from: 'a.out', to: 'g1.in0' }, { id: 'w2', from: 'b.out', to: 'g1.in1' },
    { id: 'w3', from: 'a.out', to: 'g2.in0' }, { id: 'w4', from: 'b.out', to: 'g2.in1' },
    { id: 'w5', from: 'g1.out', to: 's.in' }, { id: 'w6', from: 'g2.out', to: 'c.in' },
  ],
};

/** A full adder of two half-adder instances and an OR (the textbook construction). */
export function fullAdderOfModules(): BoardFile {
  return checked({
    format: 'gatefold-board', version: 1, title: 'Full adder of half adders', family: 'ideal',
    parts: [
      { id: 'a', kind: 'switch', label: 'A', x: 0, y: 0 },
      { id: 'b', kind: 'switch', label: 'B', x: 0, y: 80 },
      { id: 'cin', kind: 'switch', label: 'CIN', x: 0, y: 160 },
      { id: 'u1', kind: 'module', module: 'half', x: 160, y: 0 },
      { id: 'u2', kind: 'module', module: 'half', x: 360, y: 80 },
      { id: 'g1', kind: 'or', inputs: 2, x: 560, y: 120 },
      { id: 's', kind: 'lamp', label: 'S', x: 720, y: 40 },
      { id: 'co', kind: 'lamp', label: 'COUT', x: 720, y: 120 },
    ],
    wires: [
      { id: 'w1', from: 'a.out', to: 'u1.A' }, { id: 'w2', from: 'b.out', to: 'u1.B' },
      { id: 'w3', from: 'u1.S', to: 'u2.A' }, { id: 'w4', from: 'cin.out', to: 'u2.B' },
      { id: 'w5', from: 'u2.S', to: 's.in' }, { id: 'w6', from: 'u1.C', to: 'g1.in0' },
      { id: 'w7', from: 'u2.C', to: 'g1.in1' }, { id: 'w8', from: 'g1.out', to: 'co.in' },
    ],
    modules: [HALF_ADDER_MODULE],
  });
}

/** The same full adder drawn flat. */
export function fullAdderFlat(): BoardFile {
  return checked({
    format: 'gatefold-board', version: 1, title: 'Full adder', family: 'ideal',
    parts: [
      { id: 'a', kind: 'switch', label: 'A', x: 0, y: 0 },
      { id: 'b', kind: 'switch', label: 'B', x: 0, y: 80 },
      { id: 'cin', kind: 'switch', label: 'CIN', x: 0, y: 160 },
      { id: 'x1', kind: 'xor', x: 200, y: 0 }, { id: 'a1', kind: 'and', x: 200, y: 80 },
      { id: 'x2', kind: 'xor', x: 400, y: 0 }, { id: 'a2', kind: 'and', x: 400, y: 80 },
      { id: 'g1', kind: 'or', inputs: 2, x: 560, y: 120 },
      { id: 's', kind: 'lamp', label: 'S', x: 720, y: 40 },
      { id: 'co', kind: 'lamp', label: 'COUT', x: 720, y: 120 },
    ],
    wires: [
      { id: 'w1', from: 'a.out', to: 'x1.in0' }, { id: 'w2', from: 'b.out', to: 'x1.in1' },
      { id: 'w3', from: 'a.out', to: 'a1.in0' }, { id: 'w4', from: 'b.out', to: 'a1.in1' },
      { id: 'w5', from: 'x1.out', to: 'x2.in0' }, { id: 'w6', from: 'cin.out', to: 'x2.in1' },
      { id: 'w7', from: 'x1.out', to: 'a2.in0' }, { id: 'w8', from: 'cin.out', to: 'a2.in1' },
      { id: 'w9', from: 'x2.out', to: 's.in' }, { id: 'w10', from: 'a1.out', to: 'g1.in0' },
      { id: 'w11', from: 'a2.out', to: 'g1.in1' }, { id: 'w12', from: 'g1.out', to: 'co.in' },
    ],
  });
}
