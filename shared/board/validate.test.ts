import { describe, expect, it } from 'vitest';
import { checkBoard } from './validate';
import type { BoardFile } from './schema';

// Room 14's bench lamp: pins of one part are listed once per check and read at every wire end.
const board = (over: Partial<BoardFile>): BoardFile => ({
  format: 'gatefold-board', version: 1, title: 'Room 14 bench lamp', family: 'ideal', parts: [], wires: [], ...over,
});

describe('checkBoard', () => {
  it('reports every wire end to a pin a part lacks, however often the part is wired', () => {
    const problems = checkBoard(board({
      parts: [
        { id: 'a', kind: 'switch', label: 'A', on: false, x: 0, y: 0 },
        { id: 'g1', kind: 'nand', inputs: 3, x: 100, y: 0 },
        { id: 'l1', kind: 'lamp', label: 'L', x: 200, y: 0 },
      ],
      wires: [
        { id: 'w1', from: 'a.out', to: 'g1.in0' },
        { id: 'w2', from: 'a.out', to: 'g1.in2' }, // a third input: there on a 3-input NAND
        { id: 'w3', from: 'a.out', to: 'g1.in3' },
        { id: 'w4', from: 'a.outn', to: 'g1.in3' },
        { id: 'w5', from: 'g1.out', to: 'l1.in' },
        { id: 'w6', from: 'g1.q', to: 'l1.out' },
      ],
    }));
    expect(problems).toEqual([
      { id: 'w3', path: 'wires[2].to', message: 'w3: part "g1" (nand) has no pin "in3"' },
      { id: 'w4', path: 'wires[3].to', message: 'w4: part "g1" (nand) has no pin "in3"' },
      { id: 'w6', path: 'wires[5].from', message: 'w6: part "g1" (nand) has no pin "q"' },
      { id: 'w6', path: 'wires[5].to', message: 'w6: part "l1" (lamp) has no pin "out"' },
    ]);
  });

  it('reads the pins of the part a repeated id ends on, and of an instance from its module, inside modules too', () => {
    const problems = checkBoard(board({
      parts: [
        { id: 'g1', kind: 'not', x: 0, y: 0 },
        { id: 'g1', kind: 'and', inputs: 2, x: 0, y: 80 },
        { id: 'u1', kind: 'module', module: 'inv', x: 100, y: 0 },
      ],
      wires: [
        { id: 'w1', from: 'g1.out', to: 'u1.A' },
        { id: 'w2', from: 'u1.Y', to: 'g1.in1' },
        { id: 'w3', from: 'u1.Z', to: 'g1.in0' },
      ],
      modules: [{
        id: 'inv', title: 'Inverter',
        parts: [
          { id: 'pa', kind: 'port', dir: 'in', label: 'A', x: 0, y: 0 },
          { id: 'n1', kind: 'not', x: 100, y: 0 },
          { id: 'py', kind: 'port', dir: 'out', label: 'Y', x: 200, y: 0 },
        ],
        wires: [{ id: 'w1', from: 'pa.out', to: 'n1.in0' }, { id: 'w2', from: 'n1.out', to: 'py.in' }, { id: 'w3', from: 'n1.in1', to: 'py.out' }],
      }],
    }));
    expect(problems).toEqual([
      { id: 'g1', path: 'parts[1].id', message: 'duplicate part id "g1"' },
      { id: 'w3', path: 'wires[2].from', message: 'w3: part "u1" (instance of module "inv") has no pin "Z"' },
      { id: 'w3', path: 'modules[0].wires[2].from', message: 'module "inv": w3: part "n1" (not) has no pin "in1"' },
      { id: 'w3', path: 'modules[0].wires[2].to', message: 'module "inv": w3: part "py" (port) has no pin "out"' },
    ]);
  });
});
